import type { Role } from '../../shared/api/hulls';
import type { MailMessage } from './mailer';

// The words of every mail Loftbench sends, plain text, in one place.

const roleWords: Record<Role, string> = {
  owner: 'an owner (everything on the hull, and the crew)',
  builder: 'a builder (edits the plan, prints, keeps the build log)',
  designer: 'the designer (lines, offsets and camber)',
  helper: 'a helper (reads, prints, keeps the build log)',
};

const signature = '\n--\nLoftbench: full-size patterns for the frames of small boats.\n';

function until(date: Date): string {
  return date.toISOString().slice(0, 16).replace('T', ' ') + ' UTC';
}

export function invitationMail(p: { to: string; inviterName: string; hullName: string; role: Role; link: string; expiresAt: Date }): MailMessage {
  return {
    to: p.to,
    subject: `${p.inviterName} invites you to the crew of ${p.hullName}`,
    text:
      `${p.inviterName} invites you onto the crew of the hull "${p.hullName}" in Loftbench, as ${roleWords[p.role]}.\n\n` +
      `To accept, open this link (it works once, until ${until(p.expiresAt)}):\n\n${p.link}\n\n` +
      `With no Loftbench account yet, you make one there on this e-mail address. If you did not expect this, ignore it: nothing happens.\n` +
      signature,
  };
}

export function passwordResetMail(p: { to: string; link: string; expiresAt: Date }): MailMessage {
  return {
    to: p.to,
    subject: 'Choose a new Loftbench password',
    text:
      `Someone (we hope you) asked to choose a new password for the Loftbench account of this e-mail address.\n\n` +
      `Open this link to choose it (it works once, until ${until(p.expiresAt)}):\n\n${p.link}\n\n` +
      `Choosing a new password signs the account out everywhere. If you did not ask, ignore this mail: your password stays as it is.\n` +
      signature,
  };
}

export function noticeMail(p: { to: string; hullName: string; itemName: string; authorName: string; pinnedNumber: number; newNumber: number; link: string }): MailMessage {
  return {
    to: p.to,
    subject: `Newer revision of ${p.itemName} (${p.hullName})`,
    text:
      `${p.authorName} published revision ${p.newNumber} of "${p.itemName}" in the Library. ` +
      `Your hull "${p.hullName}" took revision ${p.pinnedNumber}.\n\n` +
      `Compare the two, see how far each part would move, and move the hull or stay:\n\n${p.link}\n\n` +
      `Nothing changes on the hull until someone on its crew moves it.\n` +
      `You get these mails because you asked for them; turn them off under Account in Loftbench.\n` +
      signature,
  };
}
