import { NewCustomerScreen } from '../../../features/customers/NewCustomerScreen';

export default NewCustomerScreen;
