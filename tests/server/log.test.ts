/** The real logger's redaction, read from a stream it writes to (the app's own log is silent under test). */
import { Writable } from 'node:stream';
import { expect, test } from 'vitest';
import { createLogger } from '../../server/log';

function captured() {
  const lines: string[] = [];
  const logger = createLogger(new Writable({ write: (chunk, _e, done) => (lines.push(String(chunk)), done()) }), 'info');
  return { logger, lines, entries: () => lines.map((l) => JSON.parse(l)) };
}

test('passwords, tokens, cookies and authorization headers are redacted wherever they sit', () => {
  const { logger, lines, entries } = captured();
  logger.info(
    {
      email: 'ines@harborlane.test',
      password: 'pw-top',
      token: 'tok-top',
      cookie: 'ck-top',
      user: { password: 'pw-user', newPassword: 'pw-new', currentPassword: 'pw-current' },
      req: { headers: { cookie: 'ck-req', authorization: 'Bearer auth-req' }, body: { password: 'pw-body', token: 'tok-body' } },
      res: { headers: { 'set-cookie': 'ck-set' } },
      err: { request: { headers: { Authorization: 'Bearer auth-err' } } },
    },
    'a request went wrong',
  );
  expect(lines).toHaveLength(1);
  expect(lines[0]).not.toMatch(/pw-|tok-|ck-|auth-/);
  const [entry] = entries();
  expect(entry).toMatchObject({
    msg: 'a request went wrong',
    app: 'rackside',
    // What is not secret stays readable.
    email: 'ines@harborlane.test',
    password: '[redacted]',
    token: '[redacted]',
    cookie: '[redacted]',
    user: { password: '[redacted]', newPassword: '[redacted]', currentPassword: '[redacted]' },
    req: { headers: { cookie: '[redacted]', authorization: '[redacted]' }, body: { password: '[redacted]', token: '[redacted]' } },
    res: { headers: { 'set-cookie': '[redacted]' } },
    err: { request: { headers: { Authorization: '[redacted]' } } },
  });
});

test('the message and fields that are not secret are logged as given', () => {
  const { logger, entries } = captured();
  logger.warn({ event: 'sign-in-failed', email: 'theo@harborlane.test', ip: '127.0.0.1' }, 'sign-in failed');
  expect(entries()).toEqual([expect.objectContaining({ level: 40, event: 'sign-in-failed', email: 'theo@harborlane.test', ip: '127.0.0.1', msg: 'sign-in failed' })]);
});
