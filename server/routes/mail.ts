/** The outbox of the local mail fake: admins read everything, teachers what their own actions sent. */
import { Router } from 'express';
import type { WhereOptions } from 'sequelize';
import type { MailDto } from '../../shared/lessons';
import { requireTeacher } from '../auth/guards';
import { Mail } from '../db/models';
import { HttpError } from '../errors';

function dto(mail: Mail, full: boolean): MailDto {
  return {
    id: mail.id,
    to: mail.to,
    from: mail.from,
    subject: mail.subject,
    kind: mail.kind,
    receivedAt: mail.receivedAt.toISOString(),
    ...(full ? { text: mail.text, html: mail.html } : {}),
  };
}

export function mailRouter() {
  const router = Router();
  router.use(requireTeacher);

  const scope = (user: Express.User): WhereOptions<Mail> => (user.role === 'admin' ? {} : { senderId: user.id });

  router.get('/', async (req, res) => {
    const to = typeof req.query.to === 'string' ? req.query.to.trim().toLowerCase() : '';
    const rows = await Mail.findAll({ where: scope(req.user!), order: [['id', 'DESC']], limit: 200 });
    const mails = to ? rows.filter((m) => m.to.toLowerCase().includes(to)) : rows;
    res.json({ mails: mails.map((m) => dto(m, false)) });
  });

  router.get('/:id', async (req, res) => {
    const id = Number(req.params.id);
    const mail = Number.isInteger(id) && id > 0 ? await Mail.findOne({ where: { id, ...scope(req.user!) } }) : null;
    if (!mail) throw new HttpError(404, 'NOT_FOUND', 'There is no message with that id in your outbox.');
    res.json({ mail: dto(mail, true) });
  });

  return router;
}
