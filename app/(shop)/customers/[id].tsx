import { CustomerDetailScreen } from '../../../features/customers/CustomerDetailScreen';

export default CustomerDetailScreen;
