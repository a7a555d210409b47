import { screenInSteps } from '../ui/screenInSteps';

/**
 * The jobs list's route: the list's own script is small, but its first
 * `require` also evaluates the job schemas it shares with other screens (every
 * text field, status and frame choice built with zod), one task of about half
 * a second on Lighthouse's slowed phone. Here each line is a task of its own,
 * from the modules others import to those that import them.
 */
export const JobListScreenInSteps = screenInSteps(
  [
    () => require('../text/schema'),
    () => require('../settings/materials'),
    () => require('./schema'),
    () => require('./activitySchema'),
    () => require('./queries'),
    () => require('./dueRange'),
    () => require('../ui/TextField'),
    () => require('./JobFilters'),
  ],
  () => (require('./JobListScreen') as typeof import('./JobListScreen')).JobListScreen,
);
