import { screenInSteps } from '../ui/screenInSteps';

/**
 * The new-job form's route: its first `require` evaluated the job and
 * customer schemas (built with zod) with the form in one task (~90 ms on a
 * 4x slowed CPU). Here each line is a task of its own, from the modules
 * others import to those that import them.
 */
export const NewJobScreenInSteps = screenInSteps(
  [
    () => require('../text/schema'),
    () => require('../settings/materials'),
    () => require('./schema'),
    () => require('./activitySchema'),
    () => require('../customers/schema'),
    () => require('./queries'),
    () => require('../customers/queries'),
    () => require('../ui/TextField'),
    () => require('../ui/useSchemaForm'),
    () => require('../customers/CustomerChooser'),
    () => require('../customers/NewCustomerScreen'),
  ],
  () => (require('./NewJobScreen') as typeof import('./NewJobScreen')).NewJobScreen,
);
