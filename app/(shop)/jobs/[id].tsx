import { JobDetailScreen } from '../../../features/jobs/JobDetailScreen';

export default JobDetailScreen;
