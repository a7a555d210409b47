import { ProofScreen } from '../../features/proofs/ProofScreen';

export default ProofScreen;
