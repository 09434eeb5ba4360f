/**
 * The bot tournament, on paired deals. Each deal (one seed) is played once per measured seat
 * and strategy: only the measured seat's strategy changes, the three other seats play fixed
 * strategies and every bot is seeded by deal and seat, so the runs of one deal differ only by
 * what the measured seat chose. Every deal is measured at all four seats (east holds 14 tiles
 * and passes differently). At the end of the Charleston each measured rack is judged by its
 * odds of finishing the best pattern of the list (over the tiles that seat has not seen), with
 * tiles away beside it. A deal's figure is the mean over its four seats, and strategies are
 * compared by the mean of their per-deal differences with a Student-t 95% interval.
 *
 * Run: npm run bench:bots -- [--deals N] [--seed TEXT] [--list starter|teacher|both]
 *        [--measure odds|away] [--samples N] [--draws N] [--opponents multiples|RIGHT,ACROSS,LEFT]
 *        [--rotation every-seat|one-seat-per-deal] [--workers N] [--teacher PATH]
 *
 * Deals are independent, so they are split over --workers child processes (2 by default, for
 * the two cores; 1 plays them in this process); the figures are the same for any count.
 * --measure away judges on tiles away alone, without finishing odds.
 */
import cliProgress from 'cli-progress';
import { fork } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { BOT_STRATEGIES, isBotStrategyId, starterPatterns, validatePatternList, type Pattern } from '../../shared/analysis';
import {
  awayMeasure,
  DIRECTIONS,
  GOAL_COMPARISONS,
  oddsMeasure,
  playDeal,
  runTournament,
  sameOpponents,
  summarize,
  type DealResult,
  type Interval,
  type Measure,
  type Opponents,
  type Rotation,
  type TournamentSummary,
} from '../../shared/analysis/tournament';
import { ODDS_DEFAULTS } from '../../shared/analysis/odds';
import { SEATS } from '../../shared/seats';
import { readPatternListJson } from '../../server/teaching/pattern-lists/file-json';

function argValue(name: string, fallback: string): string {
  const args = process.argv.slice(2);
  for (let i = 0; i < args.length; i++) {
    if (args[i] === `--${name}`) return args[i + 1] ?? fallback;
    if (args[i].startsWith(`--${name}=`)) return args[i].slice(name.length + 3);
  }
  return fallback;
}

function fail(message: string): never {
  console.error(message);
  process.exit(1);
}

function wholeNumber(name: string, fallback: string): number | undefined {
  const text = argValue(name, fallback);
  if (text === '') return undefined;
  const n = Number(text);
  if (!Number.isInteger(n) || n < 1) fail(`--${name} takes a whole number above 0, for example --${name} ${fallback || 100}.`);
  return n;
}

const DEFAULT_DEALS = '300';
const deals = wholeNumber('deals', DEFAULT_DEALS)!;
const prefix = argValue('seed', 'rackside-tournament');
const listChoice = argValue('list', 'both');
if (!['starter', 'teacher', 'both'].includes(listChoice)) fail('--list takes starter, teacher or both.');
const measureChoice = argValue('measure', 'odds');
if (!['odds', 'away'].includes(measureChoice)) fail('--measure takes odds (finishing odds, tiles away beside) or away (tiles away alone).');
const samples = wholeNumber('samples', '');
const drawsLeft = wholeNumber('draws', '');
const workers = wholeNumber('workers', '2')!;
const rotation = argValue('rotation', 'every-seat') as Rotation;
if (!['every-seat', 'one-seat-per-deal'].includes(rotation)) fail('--rotation takes every-seat or one-seat-per-deal.');

function parseOpponents(text: string): Opponents {
  const parts = text.split(',').map((s) => s.trim());
  if (parts.length === 1 && isBotStrategyId(parts[0])) return sameOpponents(parts[0]);
  if (parts.length === 3 && parts.every(isBotStrategyId)) return { right: parts[0], across: parts[1], left: parts[2] };
  return fail(`--opponents takes one strategy for all three other seats, or three (right,across,left): ${BOT_STRATEGIES.map((s) => s.id).join(', ')}.`);
}
const opponents = parseOpponents(argValue('opponents', 'multiples'));

const TEACHER_DEFAULT = 'tests/fixtures/teacher-list.json';
const teacherPath = argValue('teacher', TEACHER_DEFAULT);
const TEACHER_FILE = teacherPath === TEACHER_DEFAULT ? fileURLToPath(new URL('../fixtures/teacher-list.json', import.meta.url)) : resolve(teacherPath);

/** Finishing odds by default; tiles away alone behind --measure away. */
function chooseMeasure(): { measure: Measure; words: string } {
  if (measureChoice === 'away') return { measure: awayMeasure, words: 'tiles away from the closest pattern (no finishing odds: --measure away)' };
  const how = [`${samples ?? ODDS_DEFAULTS.samples} samples`, `${drawsLeft ?? ODDS_DEFAULTS.drawsLeft} draws left`].join(', ');
  return {
    measure: oddsMeasure({ samples, drawsLeft }),
    words: `odds of finishing the best pattern of the list (completionOdds, ${how}, over the tiles the seat has not seen: the full set less its rack), tiles away beside`,
  };
}

interface NamedList {
  key: 'starter' | 'teacher';
  name: string;
  patterns: Pattern[];
}

function loadTeacherList(): NamedList | string {
  if (!existsSync(TEACHER_FILE)) return `${teacherPath} was not found; the teacher list is skipped.`;
  const text = readFileSync(TEACHER_FILE, 'utf8');
  try {
    const data: unknown = JSON.parse(text);
    if (Array.isArray(data)) {
      const errors = validatePatternList(data);
      if (errors.length) return `${teacherPath} has problems, so it is skipped:\n  ${errors.slice(0, 5).join('\n  ')}`;
      return { key: 'teacher', name: `Teacher list (${teacherPath})`, patterns: data as Pattern[] };
    }
    const file = readPatternListJson(text);
    return { key: 'teacher', name: `${file.name} (${teacherPath})`, patterns: file.patterns };
  } catch (error) {
    const problems = (error as { problems?: { where: string; message: string }[] }).problems;
    const detail = problems ? problems.slice(0, 5).map((p) => `${p.where}: ${p.message}`).join('\n  ') : String(error);
    return `${teacherPath} could not be read, so it is skipped:\n  ${detail}`;
  }
}

// ───────────── printing ─────────────

function table(headers: string[], rows: string[][]): string {
  const widths = headers.map((h, c) => Math.max(h.length, ...rows.map((r) => r[c].length)));
  const line = (cells: string[]) => `  ${cells.map((cell, c) => (c === 0 ? cell.padEnd(widths[c]) : cell.padStart(widths[c]))).join('   ')}`;
  return [line(headers), `  ${widths.map((w) => '─'.repeat(w)).join('   ')}`, ...rows.map(line)].join('\n');
}

const pct = (x: number) => `${(100 * x).toFixed(2)}%`;
const signed = (x: number, digits: number, unit = '') => `${x >= 0 ? '+' : '−'}${Math.abs(x).toFixed(digits)}${unit}`;
const meanPct = (i: Interval | null) => (i ? `${pct(i.mean)} ± ${(100 * i.half).toFixed(2)}` : '—');
const meanAway = (i: Interval) => `${i.mean.toFixed(2)} ± ${i.half.toFixed(2)}`;
const range = (i: Interval, scale: number, digits: number, unit = '') =>
  `${signed(scale * i.mean, digits, unit)} [${signed(scale * i.low, digits)}, ${signed(scale * i.high, digits)}]`;
const strategyName = (id: string) => `${id} (${BOT_STRATEGIES.find((s) => s.id === id)?.name ?? id})`;

function report(list: NamedList, summary: TournamentSummary, seconds: number) {
  console.log(`\n═══ ${list.name}: ${list.patterns.length} patterns ═══`);
  console.log(`${summary.deals} deals × ${rotation === 'every-seat' ? '4 measured seats' : '1 measured seat'}, ${seconds.toFixed(1)} s. Exchanges stopped after the first Charleston in ${pct(summary.stoppedEarly)} of measured runs.\n`);
  console.log('Per strategy, the mean over deals of the deal’s mean over its four seats, ± the half-width of the 95% interval:');
  console.log(
    table(
      ['strategy in the measured seat', 'finishing odds', 'tiles away'],
      summary.rows.map((r) => [strategyName(r.strategy), meanPct(r.odds), meanAway(r.away)]),
    ),
  );
  console.log('\nPaired differences, per deal then averaged, mean [95% interval]:');
  console.log(
    table(
      ['comparison', 'finishing odds, points', 'tiles closer', `beats it on ${summary.judgedOn === 'odds' ? 'odds' : 'tiles away'}`],
      summary.differences.map((d) => [
        `${d.better} − ${d.worse}`,
        d.odds ? range(d.odds, 100, 2) : '—',
        range(d.closer, 1, 2),
        d.holds ? 'yes, interval above 0' : 'no, interval reaches 0',
      ]),
    ),
  );
  console.log('\nBy seat (mean over every run at that seat; seats of a deal are not independent, so no intervals):');
  console.log(
    table(
      ['strategy', ...SEATS.map((s) => `${s} odds / away`)],
      summary.rows.map((r) => [
        r.strategy,
        ...SEATS.map((seat) => {
          const f = summary.bySeat[r.strategy][seat];
          return f ? `${f.odds === null ? '—' : pct(f.odds)} / ${f.away.toFixed(2)}` : '—';
        }),
      ]),
    ),
  );
  const goal = GOAL_COMPARISONS.map(([a, b]) => `${a} beats ${b}`).join(', and ');
  console.log(
    `\nGoal on ${list.key === 'starter' ? 'the starter list' : 'the teacher list'} (${goal}, each by a margin whose 95% interval excludes 0, judged on ${
      summary.judgedOn === 'odds' ? 'finishing odds' : 'tiles away'
    }): ${summary.goalHolds ? 'MET' : 'NOT MET'}.`,
  );
}

// ───────────── running ─────────────

interface Job {
  patterns: Pattern[];
  indexes: number[];
}
type WorkerMessage = { deal: DealResult } | { done: true } | { error: string };

/** A child process: plays the deals it is sent, one message per deal, with the measure the same flags choose. */
function runWorker() {
  const { measure } = chooseMeasure();
  process.once('message', (job: Job) => {
    try {
      for (const index of job.indexes) {
        process.send!({ deal: playDeal({ prefix, index, list: job.patterns, measure, opponents, rotation }) } satisfies WorkerMessage);
      }
      process.send!({ done: true } satisfies WorkerMessage, () => process.disconnect());
    } catch (error) {
      process.send!({ error: error instanceof Error ? (error.stack ?? error.message) : String(error) } satisfies WorkerMessage, () => process.disconnect());
    }
  });
}

/** Deals i, i + w, i + 2w … go to worker i; the results are put back in deal order, so any worker count gives the same figures. */
function playInWorkers(patterns: Pattern[], onDeal: (done: number) => void): Promise<DealResult[]> {
  const results: DealResult[] = [];
  const children = Array.from({ length: Math.min(workers, deals) }, (_, w) => {
    const indexes = Array.from({ length: deals }, (_, i) => i).filter((i) => i % workers === w);
    const child = fork(fileURLToPath(import.meta.url), [...process.argv.slice(2), '--worker'], { execArgv: ['--import', 'tsx'], stdio: ['ignore', 'inherit', 'inherit', 'ipc'] });
    return new Promise<void>((done, failed) => {
      child.on('message', (message: WorkerMessage) => {
        if ('error' in message) return failed(new Error(message.error));
        if ('done' in message) return;
        results.push(message.deal);
        onDeal(results.length);
      });
      child.on('exit', (code) => (code === 0 ? done() : failed(new Error(`A tournament worker stopped with exit code ${code}.`))));
      child.send({ patterns, indexes } satisfies Job);
    });
  });
  return Promise.all(children).then(() => results.sort((a, b) => a.index - b.index));
}

async function main() {
  const { measure, words } = chooseMeasure();
  const lists: NamedList[] = [];
  if (listChoice !== 'teacher') lists.push({ key: 'starter', name: 'Starter list', patterns: starterPatterns });
  if (listChoice !== 'starter') {
    const teacher = loadTeacherList();
    if (typeof teacher === 'string') console.log(`Note: ${teacher}`);
    else lists.push(teacher);
  }
  if (lists.length === 0) fail('No list to play on.');

  const sameAround = DIRECTIONS.every((d) => opponents[d] === opponents.right);
  console.log(
    [
      `Bot tournament: ${deals} paired deals (seeds ${prefix}-0 … ${prefix}-${deals - 1}), ${workers === 1 ? 'in this process' : `split over ${workers} processes`}.`,
      `Measured seat: ${rotation === 'every-seat' ? 'every deal is measured at all four seats' : 'deal i is measured at seat i mod 4'}; only its strategy changes between runs of a deal.`,
      `Other seats: ${sameAround ? `all three ${strategyName(opponents.right)}` : DIRECTIONS.map((d) => `${d} of it ${strategyName(opponents[d])}`).join(', ')}; every bot seeded by deal and seat.`,
      `Measure at the end of the Charleston: ${words}.`,
      'Intervals: Student t, 95%, over deals (a deal’s figure is the mean over its measured seats).',
    ].join('\n'),
  );

  for (const list of lists) {
    const bar = new cliProgress.SingleBar(
      { format: `${list.key} [{bar}] {value}/{total} deals · {duration_formatted}`, stream: process.stderr, hideCursor: true },
      cliProgress.Presets.shades_classic,
    );
    const started = performance.now();
    bar.start(deals, 0);
    const onDeal = (done: number) => bar.update(done);
    const played =
      workers === 1
        ? runTournament({ prefix, deals, list: list.patterns, measure, opponents, rotation, onDeal }).deals
        : await playInWorkers(list.patterns, onDeal);
    bar.stop();
    report(list, summarize(played), (performance.now() - started) / 1000);
  }
}

if (process.argv.includes('--worker')) runWorker();
else await main();
