import { NewJobScreenInSteps } from '../../../features/jobs/NewJobScreenInSteps';

export default NewJobScreenInSteps;
