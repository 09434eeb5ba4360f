/**
 * Three racks a teacher would test, with Rackside's focus and advice as a player would read
 * them: one built around multiples, one around evens, one around a joker with flowers.
 *
 * Run: npx tsx tests/bench/advice-examples.ts [--list starter|PATH] [--top N]
 */
import { readFileSync } from 'node:fs';
import { adviseRack, starterPatterns, type AdviceContext, type Pattern } from '../../shared/analysis';
import { tileName, type TileKind } from '../../shared/tiles';

function argValue(name: string, fallback: string): string {
  const args = process.argv.slice(2);
  const at = args.indexOf(`--${name}`);
  return at >= 0 ? (args[at + 1] ?? fallback) : fallback;
}

const listArg = argValue('list', 'starter');
const list: Pattern[] = listArg === 'starter' ? starterPatterns : (JSON.parse(readFileSync(listArg, 'utf8')) as { patterns: Pattern[] }).patterns;
const top = Number(argValue('top', '3'));

const racks: { title: string; rack: TileKind[]; context: AdviceContext }[] = [
  {
    title: 'Built around multiples: a pung of 3 bams, pairs of 3 cracks, 7 dots and east winds',
    rack: ['bam3', 'bam3', 'bam3', 'crack3', 'crack3', 'dot7', 'dot7', 'wind-e', 'wind-e', 'bam9', 'crack6', 'dragon-green', 'dot1'],
    context: { phase: 'first-right', blindAllowed: false },
  },
  {
    title: 'Built around evens: pairs of 2, 4, 6 and 8 bams and a flower',
    rack: ['bam2', 'bam2', 'bam4', 'bam4', 'bam6', 'bam6', 'bam8', 'bam8', 'flower', 'crack3', 'wind-w', 'dot7', 'crack9'],
    context: { phase: 'first-across', blindAllowed: false },
  },
  {
    title: 'A joker with three flowers',
    rack: ['joker', 'flower', 'flower', 'flower', 'bam3', 'bam7', 'crack2', 'crack5', 'dot9', 'wind-n', 'dragon-red', 'dot4', 'crack8'],
    context: { phase: 'first-left', blindAllowed: true },
  },
];

const names = (kinds: readonly TileKind[]) => kinds.map(tileName).join(', ');
const MARK = { pro: '+', con: '−', defence: '!' } as const;

for (const { title, rack, context } of racks) {
  const started = performance.now();
  const { advice, focus } = adviseRack(rack, list, context);
  const ms = performance.now() - started;
  console.log(`\n━━ ${title}`);
  console.log(`Rack: ${names(rack)}`);
  console.log(`Pass: ${context.phase}${context.blindAllowed ? ', blind allowed' : ''} (${ms.toFixed(0)} ms)`);
  console.log('Focus:');
  for (const line of focus.words) console.log(`  ${line}`);
  advice.slice(0, top).forEach((a, i) => {
    const what = [names(a.tiles), a.blind > 0 ? `${a.blind} blind` : ''].filter(Boolean).join(' + ');
    const odds = a.odds ? `, odds ${(100 * a.odds.before).toFixed(0)}% → ${(100 * a.odds.after).toFixed(0)}%` : '';
    console.log(`${i + 1}. Pass ${what}${odds}, risk ${a.risk.level}${a.toward ? `, toward ${a.toward.name}` : ''}`);
    for (const d of a.details) console.log(`     ${MARK[d.kind]} ${d.text}`);
  });
}
console.log('\n+ a benefit, − a drawback, ! the risk of feeding the neighbour the pass goes to.');
