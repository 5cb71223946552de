import type { Role } from '@shared/schemas/roles';

const escapeHtml = (value: string) =>
  value.replace(/[&<>"']/g, (char) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[char]!);

function wrap(paragraphs: string[], link: { href: string; label: string }): string {
  const body = paragraphs.map((text) => `<p>${escapeHtml(text)}</p>`).join('\n');
  return `<!doctype html><html><body style="font-family: Lato, Arial, sans-serif; color: #1c1938;">
${body}
<p><a href="${escapeHtml(link.href)}" style="background:#f09a27;color:#121026;padding:8px 14px;border-radius:6px;text-decoration:none;font-weight:bold;">${escapeHtml(link.label)}</a></p>
<p style="color:#625ba3;font-size:12px;">Sent by Halflight. If you did not expect this message, you can ignore it.</p>
</body></html>`;
}

export function invitationMessage(input: {
  labName: string;
  inviterName: string;
  role: Role;
  link: string;
  expiresAt: Date;
}) {
  const expires = input.expiresAt.toUTCString();
  const paragraphs = [
    `${input.inviterName} has invited you to join "${input.labName}" on Halflight as ${input.role}.`,
    'Halflight is where the lab keeps its quenching titrations, fits and redox potentials.',
    `The link below works once and expires on ${expires}.`,
  ];
  return {
    subject: `Join ${input.labName} on Halflight`,
    text: `${paragraphs.join('\n\n')}\n\nAccept the invitation:\n${input.link}\n\nIf you did not expect this message, you can ignore it.\n`,
    html: wrap(paragraphs, { href: input.link, label: 'Accept the invitation' }),
  };
}

export function passwordResetMessage(input: { name: string; link: string }) {
  const paragraphs = [
    `Hello ${input.name},`,
    'someone (we hope you) asked to set a new Halflight password for this address.',
    'The link below works once, for one hour. Your current password stays valid until you use it.',
  ];
  return {
    subject: 'Set a new Halflight password',
    text: `${paragraphs.join('\n\n')}\n\nChoose a new password:\n${input.link}\n\nIf you did not ask for this, you can ignore this message.\n`,
    html: wrap(paragraphs, { href: input.link, label: 'Choose a new password' }),
  };
}
