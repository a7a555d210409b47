/**
 * Documents built to be expensive, timed from the stored JSON to an answer
 * (a validated layout, its findings, and for a cuttable board its cut plan
 * and DXF): each must take under a second.
 *
 *   npx tsx scripts/benchHostile.ts
 *
 * Rows: a 50 000-point spiky star outline and a 20 000-point zigzag (both
 * refused by the checks as too spiky to cut), 200 openings (checked,
 * planned and written), and 16 000 openings sharing one id (their ids made
 * unique; the layout itself is refused for having more than 200 openings).
 */
import { pathToFileURL } from 'node:url';
import { defaultShopSettings } from '../features/settings/schema';
import { checkLayout, cutPlan, cutPlanDxf, parseLayout, withUniqueIds } from '../geometry';
import { median } from './benchLayout';
import { manyOpeningsLayout, repeatedIdsOpenings, spikyStarLayout, zigzagLayout } from './hostileLayouts';

interface Row {
  readonly name: string;
  readonly ms: number;
  readonly answer: string;
}

/** Stored JSON to findings, and to a DXF when nothing blocks the cut. */
function answer(json: string): string {
  const parsed = parseLayout(JSON.parse(json));
  if (!parsed.ok) return `refused: ${parsed.issues[0]?.path} ${parsed.issues[0]?.message}`;
  const errors = checkLayout(parsed.layout).filter((f) => f.severity === 'error');
  if (errors.length > 0) return `422: ${errors.map((f) => f.code).join(', ')}`;
  cutPlanDxf(cutPlan(parsed.layout, defaultShopSettings.cutterProfiles[0]!));
  return `cut file written, ${parsed.repairs.length} repairs`;
}

function row(name: string, document: unknown, repeats = 5): Row {
  const json = JSON.stringify(document);
  answer(json); // warm the JIT so the row is what a running server pays
  return { name, ms: median(() => answer(json), repeats), answer: answer(json) };
}

/** 16 000 openings sharing one id: the schema refuses that many, and the one-pass renaming parseLayout uses is timed on all of them. */
function repeatedIdsRow(): Row {
  const openings = repeatedIdsOpenings(16_000);
  const json = JSON.stringify({ ...manyOpeningsLayout(1), openings });
  const ms = median(() => {
    answer(json);
    withUniqueIds(openings, 'opening id', []);
  }, 5);
  const ids = new Set(withUniqueIds(openings, 'opening id', []).map((o) => o.id));
  return { name: '16 000 repeated ids', ms, answer: `${answer(json)}; renaming alone makes ${ids.size} unique ids` };
}

export function benchHostileReport(): string {
  const rows = [
    row('50 000-point spiky star', spikyStarLayout(50_000)),
    row('20 000-point zigzag', zigzagLayout(20_000)),
    row('200 openings', manyOpeningsLayout(200)),
    repeatedIdsRow(),
  ];
  const lines = rows.map((r) => `  ${r.name.padEnd(26)} ${r.ms.toFixed(1).padStart(8)} ms  ${r.ms < 1000 ? 'ok ' : 'SLOW'}  ${r.answer}`);
  return ['hostile documents, stored JSON to an answer (median of 5, target < 1000 ms each)', ...lines].join('\n');
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) process.stdout.write(`${benchHostileReport()}\n`);
