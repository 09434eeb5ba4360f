/**
 * Sending one lesson invitation, once. Two requests for the same lesson and address at the same
 * moment (a double click, or two tabs) must send one mail, on one process or several. Each send
 * first claims the address with an invitation row whose `tokenHash` is a claim key made from the
 * last finished invitation to that address; the unique key on `tokenHash` lets exactly one claim
 * in. A finished send replaces its claim with the hash of its link, so a later, deliberate resend
 * makes a new key and goes out (ending the older link).
 */
import { createHash } from 'node:crypto';
import { Op, UniqueConstraintError } from 'sequelize';
import { Enrollment, Invitation } from '../../db/models';
import { hashToken, signToken } from '../../services/tokens';

const CLAIM = 'sending-';
/** A claim this old belongs to a send that stopped half-way (a process that died): it is cleared. */
const STALE_CLAIM_MS = 5 * 60 * 1000;

function claimKey(lessonId: number, email: string, lastFinished: number): string {
  const digest = createHash('sha256').update(`${lessonId}|${email}|${lastFinished}`).digest('hex');
  return CLAIM + digest.slice(0, 64 - CLAIM.length); // tokenHash holds 64 characters
}

export type InviteOutcome = { status: 'sent' } | { status: 'already-sending' } | { status: 'failed'; error: unknown };

/**
 * Claims the address, ends its older unused links, mails the new link through `mail`, then makes
 * the link valid. A mail that fails removes the invitation again.
 */
export async function inviteOnce(options: { lessonId: number; email: string; expiresAt: Date; secret: string; mail: (token: string) => Promise<void> }): Promise<InviteOutcome> {
  const { lessonId, email, expiresAt, secret } = options;
  const claimed = await claim(lessonId, email, expiresAt);
  if (!claimed) return { status: 'already-sending' };
  // A new invitation replaces any unused one to the same address.
  await Invitation.update({ expiresAt: new Date() }, { where: { lessonId, email, usedAt: null, expiresAt: { [Op.gt]: new Date() }, id: { [Op.ne]: claimed.id } } });
  const token = signToken(secret, 'invitation', claimed.id, expiresAt);
  try {
    await options.mail(token);
  } catch (error) {
    await claimed.destroy();
    return { status: 'failed', error };
  }
  await claimed.update({ tokenHash: hashToken(token) });
  return { status: 'sent' };
}

async function claim(lessonId: number, email: string, expiresAt: Date, again = true): Promise<Invitation | null> {
  const lastFinished = (await Invitation.max<number | null, Invitation>('id', { where: { lessonId, email, tokenHash: { [Op.notLike]: `${CLAIM}%` } } })) ?? 0;
  const key = claimKey(lessonId, email, lastFinished);
  try {
    return await Invitation.create({ lessonId, email, tokenHash: key, expiresAt });
  } catch (err) {
    if (!(err instanceof UniqueConstraintError)) throw err;
    const holder = await Invitation.findOne({ where: { tokenHash: key } });
    if (again && holder && Date.now() - holder.createdAt.getTime() > STALE_CLAIM_MS) {
      await Invitation.destroy({ where: { id: holder.id, tokenHash: key } });
      return claim(lessonId, email, expiresAt, false);
    }
    return null;
  }
}

/**
 * Whether a later invitation to the same address for the same lesson exists (sent, or being sent):
 * a resend ends the older links early, so such a link was replaced rather than left to expire.
 */
export async function replacedByNewer(invitation: Invitation): Promise<boolean> {
  const newer = await Invitation.count({ where: { lessonId: invitation.lessonId, email: invitation.email, id: { [Op.gt]: invitation.id } } });
  return newer > 0;
}

/** Marks an existing account as invited to the lesson; a place it already has (made a moment ago by a second request) is kept. */
export async function enrollInvited(lessonId: number, userId: number): Promise<void> {
  await Enrollment.create({ lessonId, userId, status: 'invited' }).catch((err: unknown) => {
    if (!(err instanceof UniqueConstraintError)) throw err;
  });
}
