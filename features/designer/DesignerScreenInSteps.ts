import { screenInSteps } from '../ui/screenInSteps';

/**
 * The designer's route: its script holds clipper, the geometry the designer
 * draws and checks with (not the cut-file writers: files are made on the
 * server), the SVG canvas and the designer's forty modules, and the
 * schemas they share with other screens. Evaluated in one go that was a
 * single task of about a second on Lighthouse's slowed phone; here each line
 * below is a task of its own, from the modules others import to those that
 * import them (paths as the modules import each other, so nothing is bundled
 * twice; a path that disappears fails the web build).
 */
export const DesignerScreenInSteps = screenInSteps(
  [
    () => require('../text/schema'),
    () => require('../shipping/schema'),
    () => require('../proofs/schema'),
    () => require('../settings/materials'),
    () => require('../settings/priceList'),
    () => require('../settings/schema'),
    () => require('../pieces/schema'),
    () => require('../layouts/schema'),
    () => require('../exports/schema'),
    () => require('clipper-lib'),
    () => require('../../geometry/units'),
    () => require('../../geometry/polygon'),
    () => require('../../geometry/selfIntersection'),
    () => require('../../geometry/sweepStatus'),
    () => require('../../geometry/shapes'),
    () => require('../../geometry/clip'),
    () => require('../../geometry/layoutSchema'),
    () => require('../../geometry/layout'),
    () => require('../../geometry/garment'),
    () => require('../../geometry/openingLines'),
    () => require('../../geometry/bridges'),
    () => require('../../geometry/findings'),
    () => require('../../geometry/engine'),
    () => require('../../geometry/checks'),
    () => require('../../geometry/arrange'),
    () => require('../../geometry/sizing'),
    () => require('../../geometry/cutPlan'),
    () => require('../layouts/queries'),
    () => require('../settings/queries'),
    () => require('../pieces/queries'),
    () => require('react-native-svg'),
    () => require('./editorState'),
    () => require('./checksProtocol'),
    () => require('./useLayoutGeometry'),
    () => require('../exports/CutFilesPanel'),
    () => require('./ChecksPanel'),
    () => require('./AddWindowPanel'),
    () => require('./OpeningProperties'),
    () => require('./MatStackPanel'),
    () => require('./VersionsPanel'),
    () => require('./DesignerPanels'),
    () => require('./MatStackDrawing'),
    () => require('./MatCanvas'),
    () => require('./useDraftAutosave'),
  ],
  () => (require('./DesignerScreen') as typeof import('./DesignerScreen')).DesignerScreen,
);
