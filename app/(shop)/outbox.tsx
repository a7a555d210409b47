import { OutboxScreen } from '../../features/outbox/OutboxScreen';

export default OutboxScreen;
