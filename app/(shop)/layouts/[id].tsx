import { DesignerScreen } from '../../../features/designer/DesignerScreen';

export default DesignerScreen;
