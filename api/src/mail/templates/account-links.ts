import { ROLE_LABELS, type Role } from '@crumbproof/shared';
import { renderMail, type RenderedMail } from './layout';

/** Hours and minutes in words: "72 hours", "1 hour", "30 minutes". */
function duration(minutes: number): string {
  if (minutes % 60 === 0) {
    const h = minutes / 60;
    return `${h} hour${h === 1 ? '' : 's'}`;
  }
  return `${minutes} minute${minutes === 1 ? '' : 's'}`;
}

/** The mail a person gets when a manager adds them: a link to choose their password. */
export function invitationMail(m: {
  kitchen: string;
  name: string;
  role: Role;
  invitedBy: string;
  url: string;
  validMinutes: number;
}): RenderedMail {
  return renderMail({
    kitchen: m.kitchen,
    subject: `You are invited to ${m.kitchen} on Crumbproof`,
    greeting: `Hello ${m.name},`,
    paragraphs: [
      `${m.invitedBy} added you to ${m.kitchen} on Crumbproof as ${ROLE_LABELS[m.role].toLowerCase()}. Crumbproof keeps the kitchen’s ingredients and recipes, works out each product’s allergen declaration and prints its labels.`,
      'Choose your password to sign in.',
    ],
    action: { label: 'Choose your password', url: m.url },
    after: [
      `The link works once, for ${duration(m.validMinutes)}. If it has run out, ask ${m.invitedBy} to send the invitation again.`,
      'If you did not expect this mail, you can leave it: nothing happens until the link is opened.',
    ],
  });
}

/** The mail of "Forgot your password?": a link to choose a new one. */
export function passwordResetMail(m: { kitchen: string; name: string; url: string; validMinutes: number }): RenderedMail {
  return renderMail({
    kitchen: m.kitchen,
    subject: `Choose a new password for ${m.kitchen} on Crumbproof`,
    greeting: `Hello ${m.name},`,
    paragraphs: [
      'Someone asked to choose a new password for your Crumbproof account, with this email address. If it was you, open the link below.',
    ],
    action: { label: 'Choose a new password', url: m.url },
    after: [
      `The link works once, for ${duration(m.validMinutes)}. Choosing a new password signs you out everywhere you are signed in.`,
      'If it was not you, leave this mail: your password stays as it is.',
    ],
  });
}
