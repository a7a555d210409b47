import { DesignerScreenInSteps } from '../../../features/designer/DesignerScreenInSteps';

export default DesignerScreenInSteps;
