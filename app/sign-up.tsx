import { SignUpScreen } from '../features/auth/SignUpScreen';

export default SignUpScreen;
