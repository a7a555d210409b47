import { SignedInFrame } from '../../features/auth/SignedInFrame';

export default SignedInFrame;
