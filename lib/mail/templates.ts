/** Plain, short messages with a text part and an HTML part. */
export type Rendered = { subject: string; text: string; html: string };

function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

/** One layout for every message: a few paragraphs and one link. */
export function renderMessage(subject: string, paragraphs: string[], link: { url: string; label: string }): Rendered {
  const text = [...paragraphs, '', `${link.label}: ${link.url}`, '', '— Pulseloom'].join('\n');
  const html = [
    '<div style="font-family:system-ui,sans-serif;font-size:15px;color:#1d2430;max-width:560px">',
    ...paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`),
    `<p><a href="${escapeHtml(link.url)}" style="color:#0f6e6a">${escapeHtml(link.label)}</a></p>`,
    '<p style="color:#5b6472;font-size:13px">— Pulseloom</p>',
    '</div>',
  ].join('');
  return { subject, text, html };
}

export function signInLinkMessage(url: string): Rendered {
  return renderMessage(
    'Your Pulseloom sign-in link',
    ['Use the link below to sign in to Pulseloom. It works once and expires in 24 hours.', 'If you did not ask for it, ignore this message.'],
    { url, label: 'Sign in to Pulseloom' },
  );
}

export function invitationMessage(labName: string, roles: string[], url: string): Rendered {
  return renderMessage(
    `You are invited to ${labName} on Pulseloom`,
    [`You have been invited to join ${labName} on Pulseloom as ${roles.join(', ')}.`, 'The link below signs you in and joins the lab. It expires in 7 days.'],
    { url, label: 'Accept the invitation' },
  );
}
