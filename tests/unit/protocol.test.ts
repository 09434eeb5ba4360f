import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { expect, expectTypeOf, test } from 'vitest';
import { BOT_STRATEGIES } from '../../shared/analysis/bots';
import { BOT_STRATEGY_IDS, type BotStrategyId } from '../../shared/bot-ids';
import { clientEventSchemas, type AckOf, type AckPayloads, type ClientEventName, type ClientToServerEvents, type TableStateDto } from '../../shared/protocol';

test('the wire offers exactly the bots there are, in their order', () => {
  expect(BOT_STRATEGIES.map((s) => s.id)).toEqual([...BOT_STRATEGY_IDS]);
  expectTypeOf<(typeof BOT_STRATEGIES)[number]['id']>().toEqualTypeOf<BotStrategyId>();
});

test('table:bot takes every bot id and nothing else', () => {
  for (const strategy of BOT_STRATEGY_IDS) expect(clientEventSchemas['table:bot'].safeParse({ seat: 'east', strategy }).success).toBe(true);
  expect(clientEventSchemas['table:bot'].safeParse({ seat: 'east', strategy: 'toString' }).success).toBe(false);
});

test('the protocol names the bots by id alone, without loading them', () => {
  const text = readFileSync(join(import.meta.dirname, '../../shared/protocol.ts'), 'utf8');
  expect(text).not.toMatch(/from ['"]\.\/analysis\/bots['"]/);
});

test('every client event has its own ack, and its callback is typed by it', () => {
  expectTypeOf<keyof AckPayloads>().toEqualTypeOf<ClientEventName>();
  expectTypeOf<AckOf<'table:join'>>().toEqualTypeOf<({ ok: true } & { state: TableStateDto }) | { ok: false; code: string; message: string }>();
  expectTypeOf<Extract<AckOf<'chat:send'>, { ok: true }>['id']>().toEqualTypeOf<string>();
  expectTypeOf<Extract<AckOf<'table:sit'>, { ok: true }>['version']>().toEqualTypeOf<number>();
  expectTypeOf<Parameters<Parameters<ClientToServerEvents['chat:send']>[1]>[0]>().toEqualTypeOf<AckOf<'chat:send'>>();
  expectTypeOf<Parameters<Parameters<ClientToServerEvents['table:join']>[1]>[0]>().toEqualTypeOf<AckOf<'table:join'>>();
});
