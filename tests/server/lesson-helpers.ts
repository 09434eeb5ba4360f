/** Helpers for lesson, mail and payment tests: the SMTP fake, mailed links, lessons in a few lines. */
import request from 'supertest';
import { Mail, type Role } from '../../server/db/models';
import type { Config } from '../../server/config';
import { startFakeSmtp } from '../../server/services/mail/fake-smtp';
import { appTest, createUser, makeApp } from './helpers';

/** An app on its own database whose mail goes over SMTP to the local fake. */
export async function lessonApp(overrides: Partial<Config> = {}) {
  const smtp = await startFakeSmtp();
  const app = await makeApp({ smtpUrl: smtp.url, ...overrides });
  return {
    ...app,
    smtp,
    async dispose() {
      await app.dispose();
      await smtp.close();
    },
  };
}

/**
 * A test API whose every test has its own lesson app (`t`, with these config overrides) and these
 * accounts (an address, a role, a password), all disposed after the test.
 */
export function lessonTest(accounts: [email: string, role?: Role, password?: string][], overrides: Partial<Config> = {}) {
  return appTest.extend('t', { auto: true }, async ({ apps }) => {
    const t = apps.adopt(await lessonApp(overrides));
    for (const [email, role, password] of accounts) await createUser(email, role, password);
    return t;
  });
}

export async function mailsTo(email: string, kind?: string) {
  const all = await Mail.findAll({ order: [['id', 'ASC']] });
  return all.filter((m) => m.to.includes(email) && (!kind || m.kind === kind));
}

/** The first Rackside link of a path kind ("/invitations/…") in a message's text. */
export function linkIn(mail: Mail, path: string): string {
  const match = mail.text.match(new RegExp(`https?://[^\\s]+${path}/[^\\s]+`));
  if (!match) throw new Error(`No ${path} link in: ${mail.text}`);
  return match[0];
}

/** "2030-05-12T19:00" a few years ahead, so tests never drift into the past. */
export const FUTURE = '2030-05-14T19:00';

export function lessonBody(extra: object = {}) {
  return {
    title: 'Harbor Lane week 1: passing right',
    startsAtLocal: FUTURE,
    timeZone: 'America/New_York',
    durationMinutes: 60,
    seats: 8,
    priceCents: 0,
    seed: 'harbor-lane-week-01',
    ...extra,
  };
}

type Agent = ReturnType<typeof request.agent> | request.Agent;

export async function createLesson(agent: Agent, extra: object = {}) {
  const res = await agent.post('/api/lessons').send(lessonBody(extra));
  if (res.status !== 201) throw new Error(`create lesson: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.lesson as { id: number; title: string };
}

/** Invites one address and returns the token from the mailed link. */
export async function inviteToken(agent: Agent, lessonId: number, email: string) {
  const res = await agent.post(`/api/lessons/${lessonId}/invitations`).send({ emails: [email] });
  if (res.status !== 201) throw new Error(`invite: ${res.status} ${JSON.stringify(res.body)}`);
  const mails = await mailsTo(email, 'invitation');
  const link = linkIn(mails[mails.length - 1], '/invitations');
  return { link, token: decodeURIComponent(new URL(link).pathname.split('/').pop()!) };
}
