/**
 * Socket.IO's packet encoder, less its search for binary data. The stock encoder walks every
 * outgoing object, key by key, to find Buffers to send apart; Rackside never sends binary, and
 * that walk cost as much as the JSON encoding itself on every per-viewer state. The text it writes
 * is the stock encoder's own (type, namespace, ack id, JSON), so the stock client decodes it.
 */
import { Decoder, Encoder, PacketType, type Packet } from 'socket.io-parser';

export class TextOnlyEncoder extends Encoder {
  override encode(packet: Packet): unknown[] {
    if (packet.type !== PacketType.EVENT && packet.type !== PacketType.ACK) return super.encode(packet);
    let text = String(packet.type);
    if (packet.nsp && packet.nsp !== '/') text += `${packet.nsp},`;
    if (packet.id != null) text += packet.id;
    if (packet.data != null) text += JSON.stringify(packet.data);
    return [text];
  }
}

export const textOnlyParser = { Encoder: TextOnlyEncoder, Decoder };
