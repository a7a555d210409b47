import { CustomersScreen } from '../../../features/customers/CustomersScreen';

export default CustomersScreen;
