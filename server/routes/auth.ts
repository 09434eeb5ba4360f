import bcrypt from 'bcryptjs';
import { Router, type Request } from 'express';
import { ipKeyGenerator } from 'express-rate-limit';
import type { Logger } from 'pino';
import { UniqueConstraintError } from 'sequelize';
import type { createPassport } from '../auth/passport';
import { loginSchema, registerSchema } from '../../shared/protocol';
import type { Config } from '../config';
import { User } from '../db/models';
import { badInput, HttpError } from '../errors';
import { httpRateLimit } from '../security/rate-limits';

async function logIn(req: Request, user: User): Promise<void> {
  // passport 0.7 regenerates the session id here, so a session fixed before sign-in is worthless.
  await new Promise<void>((resolve, reject) => req.login(user, (err) => (err ? reject(err) : resolve())));
  req.session.signedInAt = Date.now();
}

const byAddress = (req: Request) => ipKeyGenerator(req.ip ?? '');
const byAddressAndEmail = (req: Request) => `${byAddress(req)}|${String(req.body?.email ?? '').trim().toLowerCase()}`;

export function authRouter(
  passport: ReturnType<typeof createPassport>,
  config: Config,
  hooks: { onLogout?: (sessionId: string) => void; log?: Logger } = {},
) {
  const router = Router();
  const log = hooks.log;

  // Count sign-in attempts per address and e-mail, so one guessed account cannot be hammered from one place.
  const loginLimiter = httpRateLimit(config, {
    name: 'sign-in',
    limit: config.loginRateLimit,
    key: byAddressAndEmail,
    message: 'Too many sign-in attempts. Please wait a few minutes and try again.',
    skipSuccessfulRequests: true,
    onLimit: (req) => log?.warn({ event: 'sign-in-locked', email: String(req.body?.email ?? ''), ip: req.ip }, 'sign-in attempts over the limit'),
  });
  const registerLimiter = httpRateLimit(config, {
    name: 'register',
    limit: config.rateLimits.register,
    key: byAddress,
    message: 'Too many new accounts from here. Please try again later.',
    onLimit: (req) => log?.warn({ event: 'register-limited', ip: req.ip }, 'registrations over the limit'),
  });

  router.post('/register', registerLimiter, async (req, res) => {
    const parsed = registerSchema.safeParse(req.body ?? {});
    if (!parsed.success) throw badInput(parsed.error);
    const { email, password, displayName } = parsed.data;
    const taken = () =>
      new HttpError(409, 'EMAIL_TAKEN', 'An account with this e-mail already exists. Sign in instead.', { email: 'This e-mail already has an account.' });
    if (await User.findOne({ where: { email } })) throw taken();
    const passwordHash = await bcrypt.hash(password, config.bcryptRounds);
    // A second registration of the same address at the same moment (a double click) meets the unique key.
    const user = await User.create({ email, displayName, passwordHash }).catch((err: unknown) => {
      throw err instanceof UniqueConstraintError ? taken() : err;
    });
    await logIn(req, user);
    res.status(201).json({ user: user.toPublic() });
  });

  router.post('/login', loginLimiter, async (req, res, next) => {
    const parsed = loginSchema.safeParse(req.body ?? {});
    if (!parsed.success) throw badInput(parsed.error);
    req.body = parsed.data;
    const user = await new Promise<User | false>((resolve, reject) =>
      passport.authenticate('local', (err: unknown, found: User | false) => (err ? reject(err) : resolve(found)))(req, res, next),
    );
    if (!user) {
      log?.warn({ event: 'sign-in-failed', email: parsed.data.email, ip: req.ip }, 'sign-in failed');
      throw new HttpError(401, 'BAD_CREDENTIALS', 'That e-mail and password do not match. Check them and try again.');
    }
    await logIn(req, user);
    res.json({ user: user.toPublic() });
  });

  router.post('/logout', async (req, res) => {
    const sessionId = req.sessionID;
    await new Promise<void>((resolve, reject) => req.logout((err) => (err ? reject(err) : resolve())));
    await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
    if (sessionId) hooks.onLogout?.(sessionId);
    res.clearCookie('rackside.sid');
    res.json({ ok: true });
  });

  router.get('/me', (req, res) => {
    if (!req.user) throw new HttpError(401, 'UNAUTHENTICATED', 'You are not signed in.');
    res.json({ user: req.user.toPublic() });
  });

  return router;
}
