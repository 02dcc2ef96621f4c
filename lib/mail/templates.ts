import type { MailInput } from './outbox';

/** Text from people (names, notes) goes into HTML mail escaped, never as markup (ASVS 1.2.1). */
export function escapeHtml(value: string): string {
  return value.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] as string,
  );
}

/** A plain, readable HTML wrapper in our palette; every caller passes already-escaped body HTML. */
export function mailHtml(business: string, bodyHtml: string): string {
  return `<!doctype html><html><body style="margin:0;background:#f7f3ea;font-family:Arial,sans-serif;color:#1f2d24">
<div style="max-width:560px;margin:0 auto;padding:24px">
<h1 style="font-family:Georgia,serif;font-size:20px;color:#234a35;margin:0 0 16px">${escapeHtml(business)}</h1>
${bodyHtml}
<p style="font-size:12px;color:#5b6b60;margin-top:32px">Sent by ${escapeHtml(business)} through Combtrace.</p>
</div></body></html>`;
}

export function passwordMail(p: {
  kind: 'set' | 'reset';
  to: string;
  name: string;
  business: string;
  link: string;
}): MailInput {
  const subject = p.kind === 'set' ? `Set your password for ${p.business}` : `Reset your password for ${p.business}`;
  const lead =
    p.kind === 'set'
      ? `An account has been made for you at ${p.business}. Choose a password to sign in (the link works for 72 hours, once).`
      : 'Someone asked to reset the password for this e-mail address. If it was you, choose a new password (the link works for one hour, once). If not, ignore this message.';
  return {
    to: p.to,
    subject,
    text: `Hello ${p.name},\n\n${lead}\n\n${p.link}\n`,
    html: mailHtml(
      p.business,
      `<p>Hello ${escapeHtml(p.name)},</p><p>${escapeHtml(lead)}</p><p><a href="${escapeHtml(p.link)}" style="background:#234a35;color:#fff;padding:10px 16px;border-radius:6px;text-decoration:none">Choose a password</a></p><p style="font-size:13px">Or paste this link: ${escapeHtml(p.link)}</p>`,
    ),
  };
}

/** The mail that finishes a sign-up: the new customer chooses a password through the link. */
export function finishSignUpMail(p: { to: string; name: string; business: string; link: string }): MailInput {
  const lead = `Thank you for signing up at ${p.business}. Choose a password to finish creating your account (the link works for 24 hours, once). If you did not sign up, ignore this message and nothing more happens.`;
  return {
    to: p.to,
    subject: `Finish creating your account at ${p.business}`,
    text: `Hello ${p.name},\n\n${lead}\n\n${p.link}\n`,
    html: mailHtml(
      p.business,
      `<p>Hello ${escapeHtml(p.name)},</p><p>${escapeHtml(lead)}</p><p><a href="${escapeHtml(p.link)}" style="background:#234a35;color:#fff;padding:10px 16px;border-radius:6px;text-decoration:none">Choose a password</a></p><p style="font-size:13px">Or paste this link: ${escapeHtml(p.link)}</p>`,
    ),
  };
}

/** Someone tried to sign up with an address that already has an account: its owner is told, nothing else happens. */
export function accountExistsMail(p: {
  to: string;
  name: string;
  business: string;
  signInLink: string;
  resetLink: string;
}): MailInput {
  const lead = `Someone tried to create an account at ${p.business} with this e-mail address, which already has one. If it was you, sign in, or ask for a new password if you have forgotten it. If not, you need do nothing: your account is unchanged.`;
  return {
    to: p.to,
    subject: `You already have an account at ${p.business}`,
    text: `Hello ${p.name},\n\n${lead}\n\nSign in: ${p.signInLink}\nNew password: ${p.resetLink}\n`,
    html: mailHtml(
      p.business,
      `<p>Hello ${escapeHtml(p.name)},</p><p>${escapeHtml(lead)}</p><p><a href="${escapeHtml(p.signInLink)}">Sign in</a> · <a href="${escapeHtml(p.resetLink)}">Ask for a new password</a></p>`,
    ),
  };
}
