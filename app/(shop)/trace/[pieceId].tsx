import { TraceScreen } from '../../../features/trace/TraceScreen';

export default TraceScreen;
