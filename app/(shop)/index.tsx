import { JobListScreenInSteps } from '../../features/jobs/JobListScreenInSteps';

export default JobListScreenInSteps;
