import { NewJobScreen } from '../../../features/jobs/NewJobScreen';

export default NewJobScreen;
