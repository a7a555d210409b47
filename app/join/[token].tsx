import { JoinScreen } from '../../features/members/JoinScreen';

export default JoinScreen;
