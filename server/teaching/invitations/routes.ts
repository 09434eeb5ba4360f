/** Opening and accepting an e-mailed invitation: `/api/invitations/:token`. */
import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import type { InvitationPreviewDto } from '../../../shared/lessons';
import { requireUser } from '../../auth/guards';
import type { Config } from '../../config';
import { Enrollment, Invitation, Lesson, User } from '../../db/models';
import { HttpError } from '../../errors';
import { hashToken, readToken } from '../../services/tokens';
import { lessonDto } from '../lessons/service';
import { seatsTaken, seatTransaction } from '../lessons/seats';
import { replacedByNewer } from './service';

const day = (d: Date) => d.toUTCString().replace(/ GMT$/, ' UTC');

/** "t***@harborlane.test": enough to recognise one's own address, not enough to harvest it. */
export function emailHint(email: string): string {
  const [local, domain] = email.split('@');
  return `${local.slice(0, 1)}***@${domain}`;
}

export function invitationsRouter({ config, sequelize }: { config: Config; sequelize: Sequelize }) {
  const router = Router();

  /** The invitation behind a token, or the reason it cannot be used, in words for the person holding it. */
  async function usable(token: string) {
    const claim = readToken(config.linkSecret, 'invitation', token);
    const invitation = claim ? await Invitation.findByPk(claim.id) : null;
    if (!claim || !invitation || invitation.tokenHash !== hashToken(token)) {
      throw new HttpError(404, 'INVITATION_INVALID', 'This invitation link is not one we sent, or it was copied only in part. Open the link from the e-mail again, or ask your teacher for a new one.');
    }
    const lesson = (await Lesson.findByPk(invitation.lessonId))!;
    const teacher = await User.findByPk(lesson.teacherId);
    const teacherName = teacher?.displayName ?? 'your teacher';
    if (invitation.usedAt) {
      throw new HttpError(
        410,
        'INVITATION_USED',
        `This invitation was already used on ${day(invitation.usedAt)}. If that was you, sign in and open Lessons; otherwise ask ${teacherName} for a new invitation.`,
      );
    }
    if (invitation.expiresAt.getTime() <= Date.now()) {
      if (await replacedByNewer(invitation)) {
        throw new HttpError(
          410,
          'INVITATION_REPLACED',
          `This invitation was replaced by a newer one sent to ${emailHint(invitation.email)}; use the link in the latest e-mail from ${teacherName}.`,
        );
      }
      throw new HttpError(410, 'INVITATION_EXPIRED', `This invitation expired on ${day(invitation.expiresAt)}. Ask ${teacherName} to send you a new one.`);
    }
    return { invitation, lesson, teacherName };
  }

  router.get('/:token', async (req, res) => {
    const { invitation, lesson, teacherName } = await usable(String(req.params.token));
    const preview: InvitationPreviewDto = {
      lesson: {
        id: lesson.id,
        title: lesson.title,
        teacherName,
        startsAt: lesson.startsAt.toISOString(),
        timeZone: lesson.timeZone,
        durationMinutes: lesson.durationMinutes,
        priceCents: lesson.priceCents,
        currency: lesson.currency,
      },
      emailHint: emailHint(invitation.email),
      expiresAt: invitation.expiresAt.toISOString(),
    };
    res.json({ invitation: preview });
  });

  router.post('/:token/accept', requireUser, async (req, res) => {
    const token = String(req.params.token);
    const { invitation, lesson, teacherName } = await usable(token);
    const user = req.user!;
    if (user.email !== invitation.email) {
      throw new HttpError(
        403,
        'INVITATION_OTHER_EMAIL',
        `This invitation was sent to ${emailHint(invitation.email)}, and you are signed in as ${user.email}. Sign in with the invited address, or ask ${teacherName} to invite this one.`,
      );
    }
    const enrollment = await seatTransaction(sequelize, lesson.id, async (transaction) => {
      // Read again under the lock: a second click, or a second tab, finds the invitation used.
      const fresh = await Invitation.findByPk(invitation.id, { transaction });
      if (!fresh || fresh.usedAt) throw new HttpError(410, 'INVITATION_USED', 'This invitation was just used. Open Lessons to see the lesson.');
      let place = await Enrollment.findOne({ where: { lessonId: lesson.id, userId: user.id }, transaction });
      const holdsSeat = place && (place.status === 'paid' || (lesson.priceCents === 0 && place.status === 'enrolled'));
      if (lesson.priceCents === 0 && !holdsSeat && (await seatsTaken(lesson, transaction)) >= lesson.seats) {
        throw new HttpError(409, 'LESSON_FULL', `All ${lesson.seats} seats of "${lesson.title}" are taken. Ask ${teacherName} whether another seat can be opened.`);
      }
      if (!place) place = await Enrollment.create({ lessonId: lesson.id, userId: user.id, status: 'enrolled' }, { transaction });
      else if (place.status === 'invited') await place.update({ status: 'enrolled' }, { transaction });
      await fresh.update({ usedAt: new Date(), usedBy: user.id }, { transaction });
      return place;
    });
    res.json({ lesson: await lessonDto(lesson, user.id, enrollment.status, teacherName), next: lesson.priceCents && enrollment.status !== 'paid' ? 'pay' : 'ready' });
  });

  return router;
}
