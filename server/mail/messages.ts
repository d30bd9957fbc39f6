/**
 * The wording of every mail Speedwright sends, in one place. Plain text, short, and always
 * saying why the reader got it and what to do next.
 */
import type { OutgoingMail } from './outbox';

const SIGNATURE = '\n\n— Speedwright\nYou get this message because of your account with this operator in Speedwright.';

export function invitationMail(p: {
  to: string;
  displayName: string;
  operatorName: string;
  invitedBy: string;
  link: string;
  expiresAt: Date;
  /** The address already signs in for another operator (only its owner reads this mail). */
  addressInUse?: boolean;
}): OutgoingMail {
  if (p.addressInUse) {
    return {
      to: p.to,
      subject: `You are invited to ${p.operatorName} on Speedwright`,
      text:
        `Hello ${p.displayName},

` +
        `${p.invitedBy} has invited you to ${p.operatorName} on Speedwright. This address already signs in to Speedwright for another operator, ` +
        `and one address signs in for one operator only, so this invitation cannot be accepted with it.

` +
        `To join ${p.operatorName}, ask ${p.invitedBy} to invite another of your e-mail addresses. ` +
        `Your existing account is not changed, and ${p.operatorName} has not been told that it exists.

` +
        `If you were not expecting this, you can ignore the message.` +
        SIGNATURE,
    };
  }
  return {
    to: p.to,
    subject: `You are invited to ${p.operatorName} on Speedwright`,
    text:
      `Hello ${p.displayName},\n\n` +
      `${p.invitedBy} has added you to ${p.operatorName} on Speedwright, where the operator keeps its approved speed data and issues speed cards.\n\n` +
      `To choose your password and start, open this link:\n${p.link}\n\n` +
      `The link works once and until ${formatUtc(p.expiresAt)}. If it has run out, ask ${p.invitedBy} to send a new one. ` +
      `If you were not expecting this, you can ignore the message.` +
      SIGNATURE,
  };
}

export function passwordResetMail(p: { to: string; displayName: string; link: string; expiresAt: Date }): OutgoingMail {
  return {
    to: p.to,
    subject: 'Choose a new Speedwright password',
    text:
      `Hello ${p.displayName},\n\n` +
      `Someone asked to reset the password of this account. If it was you, open this link and choose a new password:\n${p.link}\n\n` +
      `The link works once and until ${formatUtc(p.expiresAt)}. Your current password keeps working until you choose a new one.\n\n` +
      `If it was not you, ignore this message; nothing changes.` +
      SIGNATURE,
  };
}

export interface RevisionMailFacts {
  to: string;
  displayName: string;
  speedBookTitle: string;
  revisionNumber: number;
  changeSummary?: string | null;
  link: string;
}

export function revisionSubmittedMail(p: RevisionMailFacts & { submittedBy: string }): OutgoingMail {
  return {
    to: p.to,
    subject: `Review needed: ${p.speedBookTitle}, revision ${p.revisionNumber}`,
    text:
      `Hello ${p.displayName},\n\n` +
      `${p.submittedBy} has submitted revision ${p.revisionNumber} of the speed book "${p.speedBookTitle}" for review.\n` +
      summaryLine(p.changeSummary) +
      `\nCompare it with the current published revision and publish it or send it back:\n${p.link}\n\n` +
      `Someone who wrote a revision cannot approve it, so it waits for another approver.` +
      SIGNATURE,
  };
}

export function revisionPublishedMail(p: RevisionMailFacts): OutgoingMail {
  return {
    to: p.to,
    subject: `New speed data: ${p.speedBookTitle}, revision ${p.revisionNumber}`,
    text:
      `Hello ${p.displayName},\n\n` +
      `Revision ${p.revisionNumber} of the speed book "${p.speedBookTitle}" is now published and replaces the earlier revision.\n` +
      summaryLine(p.changeSummary) +
      `\nOpen Speedwright while you have a connection so your device takes the new data. Speed cards made from the earlier revision are out of date; make new ones before your next flight.\n${p.link}` +
      SIGNATURE,
  };
}

export function revisionWithdrawnMail(p: RevisionMailFacts & { reason: string }): OutgoingMail {
  return {
    to: p.to,
    subject: `Withdrawn: ${p.speedBookTitle}, revision ${p.revisionNumber}`,
    text:
      `Hello ${p.displayName},\n\n` +
      `Revision ${p.revisionNumber} of the speed book "${p.speedBookTitle}" has been withdrawn and must no longer be used.\n` +
      `Reason given: ${p.reason}\n\n` +
      `Do not use speed cards made from this revision. Open Speedwright while you have a connection to see what applies now:\n${p.link}` +
      SIGNATURE,
  };
}

function summaryLine(changeSummary: string | null | undefined): string {
  return changeSummary?.trim() ? `What changed, in the author's words: ${changeSummary.trim()}\n` : '';
}

/** "2 December 2026, 14:05 UTC": mails are read in many time zones. */
export function formatUtc(date: Date): string {
  const months = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${date.getUTCDate()} ${months[date.getUTCMonth()]} ${date.getUTCFullYear()}, ${pad(date.getUTCHours())}:${pad(date.getUTCMinutes())} UTC`;
}

export function signInWaitMail(p: { to: string; displayName: string; link: string; expiresAt: Date; failures: number }): OutgoingMail {
  return {
    to: p.to,
    subject: 'Wrong passwords were typed for your Speedwright account',
    text:
      `Hello ${p.displayName},\n\n` +
      `A wrong password was typed ${p.failures} times in a row for this address. Until the right one is typed, new sign-ins ` +
      `from a device you have not used before have to wait a few minutes between tries. Devices you have signed in on before are not affected.\n\n` +
      `If it was you and you want to try again at once, open this link:\n${p.link}\n\n` +
      `The link works until ${formatUtc(p.expiresAt)}. If you have forgotten the password, ask for a new one on the sign-in page.\n\n` +
      `If it was not you, your account is safe as long as nobody knows the password; you can change it under "Change password" in the account menu.` +
      SIGNATURE,
  };
}
