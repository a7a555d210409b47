import { AccountScreen } from '../../features/auth/AccountScreen';

export default AccountScreen;
