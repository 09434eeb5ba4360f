/**
 * Password reset by mail: `POST /api/auth/password-reset {email}` mails a signed link that works
 * once and expires; `POST /api/auth/password-reset/confirm {token, password}` sets the password.
 * The request answers the same whether or not the address has an account.
 */
import bcrypt from 'bcryptjs';
import { Router } from 'express';
import { ipKeyGenerator } from 'express-rate-limit';
import { randomBytes } from 'node:crypto';
import { Op } from 'sequelize';
import { passwordResetConfirmSchema, passwordResetRequestSchema } from '../../shared/lessons';
import type { Config } from '../config';
import { PasswordReset, User } from '../db/models';
import { badInput, HttpError } from '../errors';
import { userSessionsOf } from '../auth/user-sessions';
import { log } from '../log';
import { httpRateLimit } from '../security/rate-limits';
import { publicBase } from '../services/links';
import type { Mailer } from '../services/mail/mailer';
import { passwordResetMail } from '../services/mail/messages';
import { hashToken, readToken, signToken } from '../services/tokens';

const SENT = 'If an account uses that address, we have sent it a link to choose a new password. Check your inbox (and spam folder).';

export function passwordResetRouter({ config, mailer }: { config: Config; mailer: Mailer }) {
  const router = Router();

  const limiter = httpRateLimit(config, {
    name: 'password-reset',
    limit: config.rateLimits.passwordReset,
    key: (req) => `${ipKeyGenerator(req.ip ?? '')}|${String(req.body?.email ?? '').trim().toLowerCase()}`,
    message: 'Too many reset requests. Please wait a while and try again.',
  });

  async function usable(token: string) {
    const claim = readToken(config.linkSecret, 'password-reset', token);
    const reset = claim ? await PasswordReset.findByPk(claim.id) : null;
    if (!claim || !reset || reset.tokenHash !== hashToken(token)) {
      throw new HttpError(404, 'RESET_INVALID', 'This reset link is not one we sent, or it was copied only in part. Ask for a new link.');
    }
    if (reset.usedAt) throw new HttpError(410, 'RESET_USED', 'This reset link was already used. If you still need a new password, ask for another link.');
    if (reset.expiresAt.getTime() <= Date.now()) throw new HttpError(410, 'RESET_EXPIRED', 'This reset link has expired. Ask for a new one; it works for an hour.');
    return reset;
  }

  router.post('/', limiter, async (req, res) => {
    const parsed = passwordResetRequestSchema.safeParse(req.body ?? {});
    if (!parsed.success) throw badInput(parsed.error);
    const user = await User.findOne({ where: { email: parsed.data.email } });
    if (user) {
      const expiresAt = new Date(Date.now() + config.passwordResetTtlMs);
      const reset = await PasswordReset.create({ userId: user.id, tokenHash: randomBytes(32).toString('hex'), expiresAt });
      const token = signToken(config.linkSecret, 'password-reset', reset.id, expiresAt);
      await reset.update({ tokenHash: hashToken(token) });
      const mail = passwordResetMail(user.displayName, `${publicBase(config, req)}/reset-password/${token}`, Math.round(config.passwordResetTtlMs / 60000));
      // A mail failure is logged, not shown: the answer must not tell whether the address has an account.
      await mailer.send({ to: user.email, ...mail, kind: 'password-reset' }).catch((err) => log.error({ err }, 'The reset mail could not be sent'));
    }
    res.json({ ok: true, message: SENT });
  });

  router.get('/:token', async (req, res) => {
    const reset = await usable(String(req.params.token));
    res.json({ ok: true, expiresAt: reset.expiresAt.toISOString() });
  });

  router.post('/confirm', async (req, res) => {
    const parsed = passwordResetConfirmSchema.safeParse(req.body ?? {});
    if (!parsed.success) throw badInput(parsed.error);
    const reset = await usable(parsed.data.token);
    const user = await User.findByPk(reset.userId);
    if (!user) throw new HttpError(404, 'RESET_INVALID', 'The account for this link no longer exists.');
    const passwordHash = await bcrypt.hash(parsed.data.password, config.bcryptRounds);
    // Only the first of two simultaneous uses wins; every other link for the account ends too.
    const [claimed] = await PasswordReset.update({ usedAt: new Date() }, { where: { id: reset.id, usedAt: null } });
    if (!claimed) throw new HttpError(410, 'RESET_USED', 'This reset link was already used. If you still need a new password, ask for another link.');
    await user.update({ passwordHash });
    await PasswordReset.update({ usedAt: new Date() }, { where: { userId: user.id, usedAt: null, id: { [Op.ne]: reset.id } } });
    // Whoever knew the old password is signed out everywhere: every other session ends, its sockets close.
    await userSessionsOf(req).endOthers(user.id, req.sessionID);
    res.json({ ok: true, message: 'Your password is changed. Sign in with the new one.' });
  });

  return router;
}
