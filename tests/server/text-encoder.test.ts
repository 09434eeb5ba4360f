import { Decoder, Encoder, PacketType } from 'socket.io-parser';
import fc from 'fast-check';
import { expect, test } from 'vitest';
import { TextOnlyEncoder } from '../../server/realtime/text-encoder';

// The check is against socket.io-parser's own Encoder (the stock one Socket.IO uses): for every
// packet without binary data, ours must write the very same text.
const json = fc.jsonValue({ maxDepth: 4 });

test('for packets without binary data, the text-only encoder writes exactly what the stock encoder writes', () => {
  const ours = new TextOnlyEncoder();
  const stock = new Encoder();
  fc.assert(
    fc.property(
      fc.constantFrom(PacketType.EVENT, PacketType.ACK),
      fc.constantFrom('/', '/admin'),
      fc.option(fc.nat({ max: 100000 }), { nil: undefined }),
      fc.string({ minLength: 1, maxLength: 12 }),
      json,
      (type, nsp, id, name, value) => {
        const data = type === PacketType.EVENT ? [name, value] : [value];
        const packet = { type, nsp, id, data };
        expect(ours.encode(packet)).toEqual(stock.encode(packet));
      },
    ),
    { numRuns: 300 },
  );
});

test('what it writes decodes with the stock decoder; other packet types go to the stock encoder', async () => {
  const state = { tableId: 't1', version: 7, phase: 'first-right', mySeat: 'east', myRack: [{ id: 'a1', kind: 'bam3' }] };
  const [text] = new TextOnlyEncoder().encode({ type: PacketType.EVENT, nsp: '/', data: ['table:state', state] });
  const decoded = await new Promise((resolve) => {
    const decoder = new Decoder();
    decoder.on('decoded', resolve);
    decoder.add(text as string);
  });
  expect(decoded).toMatchObject({ type: PacketType.EVENT, nsp: '/', data: ['table:state', state] });
  const connect = { type: PacketType.CONNECT, nsp: '/', data: { sid: 'abc' } };
  expect(new TextOnlyEncoder().encode(connect)).toEqual(new Encoder().encode(connect));
});
