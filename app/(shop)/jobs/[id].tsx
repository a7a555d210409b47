import { JobDetailScreenInSteps } from '../../../features/jobs/JobDetailScreenInSteps';

export default JobDetailScreenInSteps;
