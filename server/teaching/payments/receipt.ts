/** A payment as its receipt: the lesson, the payer and what happened, in words for the payer. */
import type { ReceiptDto } from '../../../shared/lessons';
import { Lesson, User, type Payment } from '../../db/models';

const STATUS_WORDS: Record<ReceiptDto['status'], string> = {
  pending: 'We are waiting for the payment service to confirm your payment. This page updates by itself.',
  paid: 'Paid. Your seat is yours.',
  'refund-due': 'The last seat went to someone else a moment before your payment arrived. Your refund is on its way.',
  refunded: 'The last seat went to someone else a moment before your payment arrived, so we refunded you in full.',
  expired: 'This checkout ran out of time before it was paid. Nothing was charged; you can start again from the lesson page.',
  failed: 'This payment could not be matched to the lesson, so no seat was given. Ask your teacher for help.',
};

const ALREADY_PAID_WORDS: Partial<Record<ReceiptDto['status'], string>> = {
  'refund-due': 'Your seat was already paid by another payment, so this one goes back to you: your refund is on its way. Your seat stays yours.',
  refunded: 'Your seat was already paid by another payment, so we refunded this one in full. Your seat stays yours.',
};

function statusWords(payment: Payment): string {
  return (payment.refundReason === 'already-paid' && ALREADY_PAID_WORDS[payment.status]) || STATUS_WORDS[payment.status];
}

export async function receipt(payment: Payment): Promise<ReceiptDto> {
  const lesson = (await Lesson.findByPk(payment.lessonId))!;
  const teacher = await User.findByPk(lesson.teacherId);
  const payer = await User.findByPk(payment.userId);
  return {
    id: payment.id,
    status: payment.status,
    amountCents: payment.amountCents,
    currency: payment.currency,
    lesson: { id: lesson.id, title: lesson.title, teacherName: teacher?.displayName ?? '', startsAt: lesson.startsAt.toISOString(), timeZone: lesson.timeZone },
    payerName: payer?.displayName ?? '',
    paidAt: payment.paidAt ? payment.paidAt.toISOString() : null,
    refundedAt: payment.refundedAt ? payment.refundedAt.toISOString() : null,
    checkoutSessionId: payment.checkoutSessionId,
    message: statusWords(payment),
  };
}
