import { NotFoundScreen } from '../features/ui/NotFoundScreen';

export default NotFoundScreen;
