import { benchLayout } from './benchLayout';
import { readDraftSaveText, parseJsonBody } from '../server/compute/draftSave';
import { draftSaveInput } from '../features/layouts/schema';
import { validLayout } from '../server/services/validLayout';
const doc = benchLayout(2000);
const text = `{"document":${JSON.stringify(doc)},"baseRevision":3}`;
console.log('bytes', text.length);
function t(name: string, f: () => unknown, n = 300) { for (let i=0;i<50;i++) f(); const s=performance.now(); for (let i=0;i<n;i++) f(); console.log(name, ((performance.now()-s)/n).toFixed(3),'ms'); }
t('JSON.parse', () => JSON.parse(text));
const body = JSON.parse(text);
t('zod draftSaveInput', () => draftSaveInput.safeParse(body));
const inp = draftSaveInput.parse(body);
t('validLayout', () => validLayout(inp.document));
const {layout} = validLayout(inp.document);
t('stringify', () => JSON.stringify(layout));
t('whole', () => readDraftSaveText(text));
