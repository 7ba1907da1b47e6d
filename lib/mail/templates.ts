// The words of Scribeline's e-mails: pure builders returning a subject, a plain-text body and a
// simple HTML body. Every interpolated value is escaped in the HTML; links must be http(s).

export type MailContent = { subject: string; text: string; html: string };

export const SAFETY_LINE =
  "Machining can hurt you. Follow your machine's manual, local rules and qualified instruction; when in doubt, stop the machine and ask.";

const HTML_ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => HTML_ESCAPES[c]);
}

/** An absolute http(s) URL, or an error: a link in a message must never run script. */
export function safeUrl(value: string, what = 'link'): string {
  let url: URL;
  try {
    url = new URL(value);
  } catch {
    throw new Error(`The ${what} is not an absolute URL: "${value}"`);
  }
  if (url.protocol !== 'http:' && url.protocol !== 'https:') throw new Error(`The ${what} must be an http(s) URL, not ${url.protocol}`);
  return url.toString();
}

// Header values must stay on one line, and a subject should read well in a list.
function oneLine(value: string, max = 200): string {
  const flat = value.replace(/[\r\n\t]+/g, ' ').replace(/\s{2,}/g, ' ').trim();
  return flat.length > max ? `${flat.slice(0, max - 1).trimEnd()}…` : flat;
}

function clip(value: string, max: number): string {
  const trimmed = value.trim();
  return trimmed.length > max ? `${trimmed.slice(0, max - 1).trimEnd()}…` : trimmed;
}

function paragraphsHtml(text: string): string {
  return text
    .split(/\n{2,}/)
    .map((p) => p.trim())
    .filter(Boolean)
    .map((p) => `<p style="margin:0 0 12px">${escapeHtml(p).replace(/\n/g, '<br>')}</p>`)
    .join('');
}

function quoteHtml(label: string, text: string): string {
  return (
    `<div style="margin:0 0 12px;padding:8px 12px;border-left:4px solid #1d3f8f;background:#efeadd">` +
    `<p style="margin:0 0 4px;font-size:12px;color:#55595e">${escapeHtml(label)}</p>` +
    `${paragraphsHtml(text)}</div>`
  );
}

function buttonHtml(href: string, label: string): string {
  return (
    `<p style="margin:16px 0"><a href="${escapeHtml(href)}" ` +
    `style="display:inline-block;padding:10px 16px;background:#1d3f8f;color:#ffffff;text-decoration:none;border-radius:6px;font-weight:600">` +
    `${escapeHtml(label)}</a></p>`
  );
}

function safetyHtml(): string {
  return (
    `<p style="margin:16px 0;padding:8px 12px;border:1px solid #c4561a;background:#fbe9dc;border-radius:6px">` +
    `<strong>⚠ Safety:</strong> ${escapeHtml(SAFETY_LINE)}</p>`
  );
}

function layoutHtml(title: string, body: string, footer: string): string {
  return (
    `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(title)}</title></head>` +
    `<body style="margin:0;padding:0;background:#f7f4ec;color:#2b2d30;font-family:system-ui,-apple-system,'Segoe UI',sans-serif;font-size:15px;line-height:1.5">` +
    `<div style="max-width:560px;margin:0 auto;padding:24px 16px">` +
    `<p style="margin:0 0 16px;font-weight:700;color:#1d3f8f">Scribeline</p>` +
    `<div style="background:#fffdf8;border:1px solid #d8d2c2;border-radius:8px;padding:20px">${body}</div>` +
    `<div style="margin-top:16px;font-size:12px;color:#55595e">${footer}</div>` +
    `</div></body></html>`
  );
}

// ----------------------------------------------------------------- session published ---

export type SessionPublishedInput = {
  recipientName: string;
  builderName: string;
  projectTitle: string;
  sessionTitle: string;
  /** As the reader should see it, e.g. "Sat 3 Oct 2026". */
  heldOn: string;
  /** A few lines of what got done; optional. */
  summary?: string;
  sessionUrl: string;
  /** Switches off the e-mail of the follow that sent this message. */
  unsubscribeUrl: string;
  /** Why the reader gets it: they follow the project (default) or its builder. */
  followed?: 'project' | 'builder';
  /** Where the reader manages everything they follow; optional. */
  settingsUrl?: string;
};

/** To a follower, when a builder publishes a new shop session. */
export function sessionPublishedMail(input: SessionPublishedInput): MailContent {
  const sessionUrl = safeUrl(input.sessionUrl, 'session link');
  const unsubscribeUrl = safeUrl(input.unsubscribeUrl, 'unsubscribe link');
  const settingsUrl = input.settingsUrl ? safeUrl(input.settingsUrl, 'settings link') : '';
  const summary = input.summary ? clip(input.summary, 600) : '';
  const byBuilder = input.followed === 'builder';
  const subject = oneLine(`New session in “${input.projectTitle}” by ${input.builderName}: ${input.sessionTitle}`);
  const why = byBuilder ? `You get this because you follow ${input.builderName} on Scribeline.` : 'You get this because you follow this project on Scribeline.';
  const stop = byBuilder ? `Stop these e-mails about ${input.builderName}’s builds` : 'Stop these e-mails for this project';
  const which = byBuilder ? `“${input.projectTitle}”, one of ${input.builderName}’s builds you follow` : `“${input.projectTitle}”, which you follow`;

  const text = [
    `Hello ${input.recipientName},`,
    '',
    `${input.builderName} has put a new shop session in the open log of ${which}.`,
    '',
    `${input.sessionTitle} (${input.heldOn})`,
    ...(summary ? ['', summary] : []),
    '',
    `Read it: ${sessionUrl}`,
    '',
    '—',
    why,
    `${stop}: ${unsubscribeUrl}`,
    ...(settingsUrl ? [`Everything you follow: ${settingsUrl}`] : []),
  ].join('\n');

  const whichHtml = byBuilder
    ? `<strong>${escapeHtml(input.projectTitle)}</strong>, one of ${escapeHtml(input.builderName)}’s builds you follow`
    : `<strong>${escapeHtml(input.projectTitle)}</strong>, which you follow`;
  const html = layoutHtml(
    subject,
    `<p style="margin:0 0 12px">Hello ${escapeHtml(input.recipientName)},</p>` +
      `<p style="margin:0 0 12px">${escapeHtml(input.builderName)} has put a new shop session in the open log of ${whichHtml}.</p>` +
      `<h1 style="margin:0 0 4px;font-size:18px">${escapeHtml(input.sessionTitle)}</h1>` +
      `<p style="margin:0 0 12px;color:#55595e">${escapeHtml(input.heldOn)}</p>` +
      (summary ? paragraphsHtml(summary) : '') +
      buttonHtml(sessionUrl, 'Read the session'),
    `${escapeHtml(why)} ` +
      `<a href="${escapeHtml(unsubscribeUrl)}" style="color:#1d3f8f">${escapeHtml(stop)}</a>.` +
      (settingsUrl ? ` <a href="${escapeHtml(settingsUrl)}" style="color:#1d3f8f">Everything you follow</a>.` : ''),
  );
  return { subject, text, html };
}

// ----------------------------------------------------------------- mentor invitation ---

export type MentorInviteInput = {
  inviterName: string;
  projectTitle: string;
  /** The signed link that accepts the invitation. */
  inviteUrl: string;
  /** As the reader should see it, e.g. "Sat 10 Oct 2026". */
  expiresOn: string;
  /** A few words from the builder; optional. */
  personalNote?: string;
  /** The invited address: accepting needs an account with exactly this address. */
  inviteeEmail?: string;
};

/** To someone a builder asks to mentor a project. */
export function mentorInviteMail(input: MentorInviteInput): MailContent {
  const inviteUrl = safeUrl(input.inviteUrl, 'invitation link');
  const note = input.personalNote ? clip(input.personalNote, 1000) : '';
  const subject = oneLine(`${input.inviterName} asks you to mentor “${input.projectTitle}”`);

  const text = [
    'Hello,',
    '',
    `${input.inviterName} is building “${input.projectTitle}” on Scribeline and would like you as a mentor.`,
    'A mentor reads the plan and the log, and flags operations that could hurt someone or spoil the part.',
    'A mentor sees the project even while it is on the bench, and the builder answers each flag.',
    ...(note ? ['', `${input.inviterName} wrote:`, note] : []),
    '',
    `Accept the invitation: ${inviteUrl}`,
    ...(input.inviteeEmail ? [`Sign in (or create an account) with ${input.inviteeEmail} to accept: the link works only for that address.`] : []),
    `The link works once, until ${input.expiresOn}. If you were not expecting this, ignore it: nothing happens.`,
    '',
    SAFETY_LINE,
  ].join('\n');

  const html = layoutHtml(
    subject,
    `<p style="margin:0 0 12px">Hello,</p>` +
      `<p style="margin:0 0 12px">${escapeHtml(input.inviterName)} is building <strong>${escapeHtml(input.projectTitle)}</strong> on Scribeline and would like you as a mentor.</p>` +
      `<p style="margin:0 0 12px">A mentor reads the plan and the log, and flags operations that could hurt someone or spoil the part. ` +
      `A mentor sees the project even while it is on the bench, and the builder answers each flag.</p>` +
      (note ? quoteHtml(`${input.inviterName} wrote:`, note) : '') +
      buttonHtml(inviteUrl, 'Accept the invitation') +
      (input.inviteeEmail
        ? `<p style="margin:0 0 12px;font-size:13px">Sign in (or create an account) with <strong>${escapeHtml(input.inviteeEmail)}</strong> to accept: the link works only for that address.</p>`
        : '') +
      `<p style="margin:0 0 12px;font-size:13px;color:#55595e">The link works once, until ${escapeHtml(input.expiresOn)}. If you were not expecting this, ignore it: nothing happens.</p>` +
      safetyHtml(),
    'Sent by Scribeline on behalf of the builder named above.',
  );
  return { subject, text, html };
}

// ----------------------------------------------------------------- risk flag answered ---

export type FlagAnsweredInput = {
  mentorName: string;
  builderName: string;
  projectTitle: string;
  /** Where the flag sits, e.g. the session or entry title. */
  flaggedItem: string;
  flagText: string;
  answerText: string;
  flagUrl: string;
  /** e.g. "Warning · Rotating work and chucks"; optional. */
  flagHeading?: string;
};

/** To the mentor, when the builder answers a risk flag the mentor raised. */
export function flagAnsweredMail(input: FlagAnsweredInput): MailContent {
  const flagUrl = safeUrl(input.flagUrl, 'flag link');
  const flag = clip(input.flagText, 1000);
  const answer = clip(input.answerText, 2000);
  const subject = oneLine(`${input.builderName} answered your flag on “${input.flaggedItem}”`);

  const text = [
    `Hello ${input.mentorName},`,
    '',
    `${input.builderName} answered the risk flag you raised on “${input.flaggedItem}” in “${input.projectTitle}”.`,
    '',
    input.flagHeading ? `Your flag (${oneLine(input.flagHeading)}):` : 'Your flag:',
    flag,
    '',
    `${input.builderName}'s answer:`,
    answer,
    '',
    `See it in the log: ${flagUrl}`,
    '',
    SAFETY_LINE,
  ].join('\n');

  const html = layoutHtml(
    subject,
    `<p style="margin:0 0 12px">Hello ${escapeHtml(input.mentorName)},</p>` +
      `<p style="margin:0 0 12px">${escapeHtml(input.builderName)} answered the risk flag you raised on <strong>${escapeHtml(input.flaggedItem)}</strong> in <strong>${escapeHtml(input.projectTitle)}</strong>.</p>` +
      quoteHtml(input.flagHeading ? `Your flag (${oneLine(input.flagHeading)}):` : 'Your flag:', flag) +
      quoteHtml(`${input.builderName}'s answer:`, answer) +
      buttonHtml(flagUrl, 'See it in the log') +
      safetyHtml(),
    'You get this because you mentor this project on Scribeline.',
  );
  return { subject, text, html };
}

// ----------------------------------------------------------------- risk flag raised ---

export type FlagRaisedInput = {
  builderName: string;
  mentorName: string;
  projectTitle: string;
  /** Where the flag sits, e.g. the entry title, or "the note at 0:42 of …". */
  flaggedItem: string;
  /** Severity in words, e.g. "Stop". */
  severity: string;
  /** What the severity asks of the builder, in a sentence. */
  severityMeaning: string;
  hazard: string;
  concern: string;
  instead: string;
  /** The builder's page where the flag is marked as seen and answered. */
  flagUrl: string;
};

/** To the builder, when a mentor raises a risk flag on their log. */
export function flagRaisedMail(input: FlagRaisedInput): MailContent {
  const flagUrl = safeUrl(input.flagUrl, 'flag link');
  const concern = clip(input.concern, 2000);
  const instead = clip(input.instead, 2000);
  const subject = oneLine(`${input.severity}: ${input.mentorName} flagged a risk on “${input.flaggedItem}”`);

  const text = [
    `Hello ${input.builderName},`,
    '',
    `${input.mentorName}, a mentor of “${input.projectTitle}”, flagged a risk on “${input.flaggedItem}”.`,
    '',
    `Severity: ${input.severity}. ${input.severityMeaning}`,
    `Hazard: ${input.hazard}`,
    '',
    'The concern:',
    concern,
    '',
    'What to do instead:',
    instead,
    '',
    `Say you have seen it, and answer it when you can: ${flagUrl}`,
    '',
    SAFETY_LINE,
  ].join('\n');

  const html = layoutHtml(
    subject,
    `<p style="margin:0 0 12px">Hello ${escapeHtml(input.builderName)},</p>` +
      `<p style="margin:0 0 12px">${escapeHtml(input.mentorName)}, a mentor of <strong>${escapeHtml(input.projectTitle)}</strong>, flagged a risk on <strong>${escapeHtml(input.flaggedItem)}</strong>.</p>` +
      `<p style="margin:0 0 12px"><strong>⚠ Severity: ${escapeHtml(input.severity)}.</strong> ${escapeHtml(input.severityMeaning)}<br>Hazard: ${escapeHtml(input.hazard)}</p>` +
      quoteHtml('The concern:', concern) +
      quoteHtml('What to do instead:', instead) +
      buttonHtml(flagUrl, 'See and answer the flag') +
      safetyHtml(),
    'You get this because you build this project on Scribeline.',
  );
  return { subject, text, html };
}

// ----------------------------------------------------------------- account mail ---

export type AccountLinkInput = {
  name: string;
  /** The signed link; it works once. */
  url: string;
  /** How long the link works, in words: "48 hours". */
  validFor: string;
};

function accountMail(subject: string, greeting: string, lines: string[], link: { url: string; label: string } | null, after: string[], footer: string): MailContent {
  const text = [greeting, '', ...lines, ...(link ? ['', `${link.label}: ${link.url}`] : []), ...(after.length ? ['', ...after] : [])].join('\n');
  const html = layoutHtml(
    subject,
    `<p style="margin:0 0 12px">${escapeHtml(greeting)}</p>` +
      lines.map((l) => `<p style="margin:0 0 12px">${escapeHtml(l)}</p>`).join('') +
      (link ? buttonHtml(link.url, link.label) : '') +
      after.map((l) => `<p style="margin:0 0 12px;font-size:13px;color:#55595e">${escapeHtml(l)}</p>`).join(''),
    footer,
  );
  return { subject: oneLine(subject), text, html };
}

/** To a new account's address: the link that verifies it. */
export function verifyAddressMail(input: AccountLinkInput): MailContent {
  const url = safeUrl(input.url, 'verification link');
  return accountMail(
    'Verify your e-mail address for Scribeline',
    `Hello ${clip(input.name, 80)},`,
    ['Follow the link below to verify this address. Until then you can build your own logs, but not comment, follow or accept a mentor invitation.'],
    { url, label: 'Verify my address' },
    [`The link works once, for ${input.validFor}. If you did not create an account on Scribeline, ignore this message: nothing happens.`],
    'Sent because someone created a Scribeline account with this address.',
  );
}

/** To the owner of an address someone tried to sign up with again. */
export function signUpAttemptMail(input: { name: string; resetUrl: string }): MailContent {
  const url = safeUrl(input.resetUrl, 'password reset link');
  return accountMail(
    'Someone tried to create a Scribeline account with your address',
    `Hello ${clip(input.name, 80)},`,
    [
      'Someone, perhaps you, tried to create a new Scribeline account with this e-mail address. You already have one, so no new account was made.',
      'If you have forgotten your password, you can choose a new one here.',
    ],
    { url, label: 'Reset my password' },
    ['If it was not you, you need do nothing: your account is unchanged.'],
    'Sent because this address belongs to a Scribeline account.',
  );
}

/** To an account's address: the link that sets a new password. */
export function passwordResetMail(input: AccountLinkInput): MailContent {
  const url = safeUrl(input.url, 'password reset link');
  return accountMail(
    'Reset your Scribeline password',
    `Hello ${clip(input.name, 80)},`,
    ['Someone asked to reset the password of the Scribeline account with this address. Follow the link to choose a new one; every device signed in to the account will be signed out.'],
    { url, label: 'Choose a new password' },
    [`The link works once, for ${input.validFor}. If you did not ask for this, ignore this message: your password stays as it is.`],
    'Sent because a password reset was asked for this address.',
  );
}

/** To the new address of an account: the link that moves the account there. */
export function confirmNewAddressMail(input: AccountLinkInput): MailContent {
  const url = safeUrl(input.url, 'confirmation link');
  return accountMail(
    'Confirm your new e-mail address for Scribeline',
    `Hello ${clip(input.name, 80)},`,
    ['You asked to use this address for your Scribeline account. Follow the link to confirm it; until then the account keeps its old address.'],
    { url, label: 'Use this address' },
    [`The link works once, for ${input.validFor}. If you did not ask for this, ignore this message.`],
    'Sent because this address was entered as the new address of a Scribeline account.',
  );
}

/** To the old address of an account whose address is about to change. */
export function addressChangeNoticeMail(input: { name: string; newEmail: string; settingsUrl: string }): MailContent {
  const url = safeUrl(input.settingsUrl, 'settings link');
  return accountMail(
    'Your Scribeline e-mail address is being changed',
    `Hello ${clip(input.name, 80)},`,
    [
      `Someone signed in to your Scribeline account asked to move it to ${input.newEmail}. The change takes effect only when that address confirms it.`,
      'If this was not you, change your password now: that signs out every device, and the pending change can be overwritten by asking for your own address again.',
    ],
    { url, label: 'Open your settings' },
    [],
    'Sent to the address the account has now.',
  );
}

/** To an account whose password was changed or reset. */
export function passwordChangedMail(input: { name: string; resetUrl: string }): MailContent {
  const url = safeUrl(input.resetUrl, 'password reset link');
  return accountMail(
    'Your Scribeline password was changed',
    `Hello ${clip(input.name, 80)},`,
    ['The password of your Scribeline account was just changed, and every device that was signed in has been signed out.', 'If this was not you, reset your password at once.'],
    { url, label: 'Reset my password' },
    [],
    'Sent to the address of the account.',
  );
}
