/** The words of every message Rackside sends, as plain text and as simple HTML. */
import { formatMoney } from '../../../shared/lessons';
import type { Lesson } from '../../db/models';

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

function lessonTime(lesson: Pick<Lesson, 'startsAt' | 'timeZone'>): string {
  const when = new Intl.DateTimeFormat('en-US', { timeZone: lesson.timeZone, dateStyle: 'full', timeStyle: 'short' }).format(lesson.startsAt);
  return `${when} (${lesson.timeZone.replace(/_/g, ' ')})`;
}

function html(paragraphs: string[], link?: { href: string; label: string }) {
  const body = paragraphs.map((p) => `<p style="font-size:18px;line-height:1.5">${escape(p)}</p>`).join('\n');
  const button = link
    ? `<p><a href="${escape(link.href)}" style="display:inline-block;padding:12px 20px;background:#0b6b65;color:#ffffff;font-size:18px;border-radius:8px;text-decoration:none">${escape(link.label)}</a></p>
<p style="font-size:16px">Or paste this address into your browser: ${escape(link.href)}</p>`
    : '';
  return `<!doctype html><html><body style="font-family:sans-serif;color:#1d2a2a">${body}\n${button}</body></html>`;
}

export function invitationMail(lesson: Lesson, teacherName: string, link: string, expiresAt: Date) {
  const price = lesson.priceCents ? `A seat costs ${formatMoney(lesson.priceCents, lesson.currency)}, paid after you accept.` : 'This lesson is free.';
  const lines = [
    `${teacherName} invites you to the Rackside lesson "${lesson.title}".`,
    `It starts ${lessonTime(lesson)} and lasts ${lesson.durationMinutes} minutes. ${price}`,
    `The link below works once and until ${expiresAt.toUTCString()}.`,
  ];
  return {
    subject: `${teacherName} invites you to "${lesson.title}"`,
    text: `${lines.join('\n\n')}\n\nAccept the invitation: ${link}\n`,
    html: html(lines, { href: link, label: 'Accept the invitation' }),
  };
}

export function passwordResetMail(displayName: string, link: string, minutes: number) {
  const lines = [
    `Hello ${displayName},`,
    `Someone (we hope you) asked to choose a new Rackside password for this address. The link works once, within ${minutes} minutes.`,
    'If it was not you, ignore this message: your password stays as it is.',
  ];
  return { subject: 'Choose a new Rackside password', text: `${lines.join('\n\n')}\n\nChoose a new password: ${link}\n`, html: html(lines, { href: link, label: 'Choose a new password' }) };
}

export function receiptMail(lesson: Lesson, payerName: string, amount: string, receiptNo: number, link: string) {
  const lines = [`Thank you, ${payerName}. Your seat in "${lesson.title}" is paid.`, `Amount: ${amount}. Receipt number: R-${receiptNo}.`, `The lesson starts ${lessonTime(lesson)}.`];
  return { subject: `Receipt for "${lesson.title}"`, text: `${lines.join('\n\n')}\n\nYour receipt: ${link}\n`, html: html(lines, { href: link, label: 'See your receipt' }) };
}

export function refundMail(lesson: Lesson, payerName: string, amount: string) {
  const lines = [
    `Sorry, ${payerName}: the last seat in "${lesson.title}" went to another student a moment before your payment arrived.`,
    `We have refunded ${amount} in full. Ask your teacher whether they can open another seat.`,
  ];
  return { subject: `Refund for "${lesson.title}"`, text: `${lines.join('\n\n')}\n`, html: html(lines) };
}

/** A second payment for a seat that was already paid (two checkouts, both paid): the later one goes back. */
export function alreadyPaidRefundMail(lesson: Lesson, payerName: string, amount: string) {
  const lines = [
    `Hello ${payerName}: your seat in "${lesson.title}" was already paid, and a second payment of ${amount} for it reached us.`,
    `We have refunded that second payment in full. Your seat stays yours; there is nothing you need to do.`,
    `The lesson starts ${lessonTime(lesson)}.`,
  ];
  return { subject: `Refund for "${lesson.title}": your seat was already paid`, text: `${lines.join('\n\n')}\n`, html: html(lines) };
}
