import { describe, expect, it } from 'vitest';

import { escapeHtml, flagAnsweredMail, mentorInviteMail, safeUrl, SAFETY_LINE, sessionPublishedMail } from '@/lib/mail/templates';

const HOSTILE = `<script>alert('x')</script> & "friends"`;
const HOSTILE_ESCAPED = '&lt;script&gt;alert(&#39;x&#39;)&lt;/script&gt; &amp; &quot;friends&quot;';

describe('escapeHtml', () => {
  // The five characters that matter in HTML text and quoted attributes (OWASP XSS prevention cheat sheet, rule 1 — common practice).
  it.each([
    ['&', '&amp;'],
    ['<', '&lt;'],
    ['>', '&gt;'],
    ['"', '&quot;'],
    ["'", '&#39;'],
    ['plain 25 H7/g6', 'plain 25 H7/g6'],
    ['&amp;', '&amp;amp;'],
  ])('%s → %s', (input, expected) => {
    expect(escapeHtml(input)).toBe(expected);
  });
});

describe('safeUrl', () => {
  it('keeps absolute http(s) links', () => {
    expect(safeUrl('https://scribeline.test/logs/plate?x=1&y=2')).toBe('https://scribeline.test/logs/plate?x=1&y=2');
    expect(safeUrl('http://127.0.0.1:3000/invite/abc')).toBe('http://127.0.0.1:3000/invite/abc');
  });
  it.each(['javascript:alert(1)', 'data:text/html,<b>x</b>', '/relative/path', 'not a url'])('refuses %s', (value) => {
    expect(() => safeUrl(value)).toThrow();
  });
});

describe('sessionPublishedMail', () => {
  const input = {
    recipientName: 'Tam',
    builderName: 'Edda Renwick',
    projectTitle: 'Cast-iron backplate',
    sessionTitle: 'Turning the spigot',
    heldOn: 'Sat 3 Oct 2026',
    summary: 'Brought the spigot to 130.02 mm, then 130.01 mm.\n\nNext: drill the bolt circle.',
    sessionUrl: 'https://scribeline.test/logs/backplate/sessions/2',
    unsubscribeUrl: 'https://scribeline.test/unfollow?token=a1b2&p=7',
  };

  it('names the project and session, and links to it and to stopping these e-mails in both parts', () => {
    const m = sessionPublishedMail(input);
    expect(m.subject).toBe('New session in “Cast-iron backplate” by Edda Renwick: Turning the spigot');
    expect(m.text).toContain('Edda Renwick has put a new shop session in the open log of “Cast-iron backplate”, which you follow.');
    expect(m.text).toContain('Hello Tam,');
    expect(m.text).toContain('Turning the spigot (Sat 3 Oct 2026)');
    expect(m.text).toContain(`Read it: ${input.sessionUrl}`);
    expect(m.text).toContain(`Stop these e-mails for this project: ${input.unsubscribeUrl}`);
    expect(m.html).toContain(`href="${escapeHtml(input.sessionUrl)}"`);
    expect(m.html).toContain('href="https://scribeline.test/unfollow?token=a1b2&amp;p=7"');
    expect(m.html).toContain('Brought the spigot to 130.02 mm, then 130.01 mm.');
  });

  it('escapes every value put into the HTML', () => {
    const m = sessionPublishedMail({ ...input, recipientName: HOSTILE, builderName: HOSTILE, projectTitle: HOSTILE, sessionTitle: HOSTILE, heldOn: HOSTILE, summary: HOSTILE });
    expect(m.html).not.toContain('<script');
    expect(m.html.split(HOSTILE_ESCAPED).length - 1).toBeGreaterThanOrEqual(6);
    // Plain text is text: the words go through as typed.
    expect(m.text).toContain(HOSTILE);
  });

  it('keeps the subject on one line', () => {
    const m = sessionPublishedMail({ ...input, sessionTitle: 'Line one\r\nBcc: someone@example.test' });
    expect(m.subject).not.toMatch(/[\r\n]/);
    expect(m.subject).toBe('New session in “Cast-iron backplate” by Edda Renwick: Line one Bcc: someone@example.test');
  });

  it('says when the reader follows the builder rather than the project, and links to their settings', () => {
    const m = sessionPublishedMail({ ...input, followed: 'builder', settingsUrl: 'https://scribeline.test/settings' });
    expect(m.text).toContain('You get this because you follow Edda Renwick on Scribeline.');
    expect(m.text).toContain(`Stop these e-mails about Edda Renwick’s builds: ${input.unsubscribeUrl}`);
    expect(m.text).toContain('Everything you follow: https://scribeline.test/settings');
    expect(m.html).toContain('href="https://scribeline.test/settings"');
  });

  it('refuses a link that is not http(s)', () => {
    expect(() => sessionPublishedMail({ ...input, sessionUrl: 'javascript:alert(1)' })).toThrow(/session link/);
    expect(() => sessionPublishedMail({ ...input, unsubscribeUrl: '/unfollow' })).toThrow(/unsubscribe link/);
  });
});

describe('mentorInviteMail', () => {
  const input = {
    inviterName: 'Edda Renwick',
    projectTitle: 'Cast-iron backplate',
    inviteUrl: 'https://scribeline.test/mentor-invite?token=eyJ.sig&x=1',
    expiresOn: 'Sat 10 Oct 2026',
    personalNote: 'Would you look over the first power-on?',
  };

  it('carries the signed link, its expiry, the note and the safety line', () => {
    const m = mentorInviteMail(input);
    expect(m.subject).toBe('Edda Renwick asks you to mentor “Cast-iron backplate”');
    expect(m.text).toContain(`Accept the invitation: ${input.inviteUrl}`);
    expect(m.text).toContain('until Sat 10 Oct 2026');
    expect(m.text).toContain('Would you look over the first power-on?');
    expect(m.text).toContain(SAFETY_LINE);
    expect(m.html).toContain('href="https://scribeline.test/mentor-invite?token=eyJ.sig&amp;x=1"');
    expect(m.html).toContain(escapeHtml(SAFETY_LINE));
  });

  it('escapes every value put into the HTML', () => {
    const m = mentorInviteMail({ ...input, inviterName: HOSTILE, projectTitle: HOSTILE, expiresOn: HOSTILE, personalNote: HOSTILE });
    expect(m.html).not.toContain('<script');
    expect(m.html).toContain(HOSTILE_ESCAPED);
  });

  it('leaves the note out when there is none', () => {
    const m = mentorInviteMail({ ...input, personalNote: undefined });
    expect(m.text).not.toContain('wrote:');
    expect(m.html).not.toContain('wrote:');
  });
});

describe('flagAnsweredMail', () => {
  const input = {
    mentorName: 'Agnes Farrow',
    builderName: 'Edda Renwick',
    projectTitle: 'Cast-iron backplate',
    flaggedItem: 'First power-on with the new plate',
    flagText: 'Check the plate is fully seated and the chuck key is out before you start the spindle.',
    answerText: 'Seated with a 0.02 mm feeler refusing all round; key in the drawer. Ran at 150 rpm first.',
    flagUrl: 'https://scribeline.test/logs/backplate/entries/9#flag-3',
  };

  it('quotes the flag and the answer, links to it, and says the safety line', () => {
    const m = flagAnsweredMail(input);
    expect(m.subject).toBe('Edda Renwick answered your flag on “First power-on with the new plate”');
    expect(m.text).toContain(input.flagText);
    expect(m.text).toContain(input.answerText);
    expect(m.text).toContain(input.flagUrl);
    expect(m.text).toContain(SAFETY_LINE);
    expect(m.html).toContain(escapeHtml(SAFETY_LINE));
    expect(m.html).toContain('href="https://scribeline.test/logs/backplate/entries/9#flag-3"');
  });

  it('escapes every value put into the HTML', () => {
    const m = flagAnsweredMail({ ...input, mentorName: HOSTILE, builderName: HOSTILE, projectTitle: HOSTILE, flaggedItem: HOSTILE, flagText: HOSTILE, answerText: HOSTILE });
    expect(m.html).not.toContain('<script');
    expect(m.html.split(HOSTILE_ESCAPED).length - 1).toBeGreaterThanOrEqual(6);
  });
});
