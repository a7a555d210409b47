import { JobListScreen } from '../../features/jobs/JobListScreen';

export default JobListScreen;
