import { SignInScreen } from '../features/auth/SignInScreen';

export default SignInScreen;
