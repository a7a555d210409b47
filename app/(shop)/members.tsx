import { MembersScreen } from '../../features/members/MembersScreen';

export default MembersScreen;
