import { screenInSteps } from '../ui/screenInSteps';

/**
 * The job page's route: its first `require` evaluated the schemas of every
 * section the page shows (pieces, layouts, quotes, proofs, payments,
 * shipping, all built with zod) and the sections themselves in one task of
 * about half a second on Lighthouse's slowed phone (blocking time ~500 ms).
 * Here each line is a task of its own, from the modules others import to
 * those that import them (paths as the modules import each other, so
 * nothing is bundled twice; a path that disappears fails the web build).
 */
export const JobDetailScreenInSteps = screenInSteps(
  [
    () => require('../text/schema'),
    () => require('../settings/materials'),
    () => require('../settings/priceList'),
    () => require('../settings/schema'),
    () => require('./schema'),
    () => require('./activitySchema'),
    () => require('../pieces/schema'),
    () => require('../layouts/schema'),
    () => require('../quotes/schema'),
    () => require('../proofs/schema'),
    () => require('../payments/schema'),
    () => require('../shipping/schema'),
    () => require('./queries'),
    () => require('../settings/queries'),
    () => require('../pieces/queries'),
    () => require('../layouts/queries'),
    () => require('../quotes/queries'),
    () => require('../proofs/queries'),
    () => require('../payments/queries'),
    () => require('../shipping/queries'),
    () => require('../ui/TextField'),
    () => require('../ui/ChoiceChips'),
    () => require('../pieces/PiecesSection'),
    () => require('../layouts/LayoutsSection'),
    () => require('./FramePanel'),
    () => require('../quotes/QuoteSection'),
    () => require('../proofs/JobProofs'),
    () => require('../payments/PaymentsPanel'),
    () => require('../shipping/ShippingSection'),
    () => require('../shipping/ArrivalSection'),
    () => require('./ActivityList'),
    () => require('./JobEditor'),
    () => require('./StatusMover'),
    // The sections write dates (features/ui/dates.ts); the first date written on a page
    // loads the browser's locale data (~35 ms on a 4x slowed CPU): a task of its own here.
    () => (require('../ui/dates') as typeof import('../ui/dates')).momentText(0),
  ],
  () => (require('./JobDetailScreen') as typeof import('./JobDetailScreen')).JobDetailScreen,
);
