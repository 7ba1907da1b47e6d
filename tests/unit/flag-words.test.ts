import { describe, expect, it } from 'vitest';
import { FLAG_HAZARDS, FLAG_SEVERITIES } from '@/db/models/risk-flag';
import { FLAG_HAZARD_OPTIONS, FLAG_SEVERITY_OPTIONS, FLAG_STATUS_LABEL, FLAG_STEP_WORDS, flagInputSchema, flagResolveSchema } from '@/lib/validations/flags';
import { escapeHtml, flagRaisedMail, SAFETY_LINE } from '@/lib/mail/templates';

describe('flag words', () => {
  it('every hazard and severity the database accepts has words, and no others', () => {
    expect(FLAG_HAZARD_OPTIONS.map((o) => o.value)).toEqual([...FLAG_HAZARDS]);
    expect(FLAG_SEVERITY_OPTIONS.map((o) => o.value)).toEqual([...FLAG_SEVERITIES]);
    for (const o of [...FLAG_HAZARD_OPTIONS, ...FLAG_SEVERITY_OPTIONS]) expect(o.label.trim()).not.toBe('');
    for (const o of FLAG_SEVERITY_OPTIONS) expect(o.meaning.length).toBeGreaterThan(10);
  });

  it('the builder’s buttons say the same as the status they lead to, in our words', () => {
    // Each step's button shares its key word with the status it sets, so the button and the badge read as one.
    const seen = FLAG_STEP_WORDS.seen;
    const answer = FLAG_STEP_WORDS.answer;
    expect(FLAG_STATUS_LABEL[seen.leadsTo].toLowerCase()).toContain('seen');
    expect(seen.button.toLowerCase()).toContain('seen');
    expect(FLAG_STATUS_LABEL[answer.leadsTo].toLowerCase()).toContain('answer');
    expect(answer.button.toLowerCase()).toContain('answer');
    expect(answer.submit.toLowerCase()).toContain('answer');
    // The database's names for the steps stay out of what the builder reads.
    for (const words of [seen.button, seen.done, answer.button, answer.submit, FLAG_STEP_WORDS.hint, ...Object.values(FLAG_STATUS_LABEL)]) {
      expect(words).not.toMatch(/acknowledg|resolv/i);
    }
  });

  it('a flag needs a severity, a hazard, the concern and what to do instead; the target defaults to the entry', () => {
    const ok = flagInputSchema.parse({ severity: 'stop', hazard: 'lifting', concern: 'Chuck is heavy', instead: 'Use a board across the bed' });
    expect(ok.target).toBe('entry');
    const bad = flagInputSchema.safeParse({ severity: 'loud', hazard: 'lifting', concern: '', instead: 'x'.repeat(2001) });
    expect(bad.success).toBe(false);
    const paths = bad.error!.issues.map((i) => i.path.join('.'));
    expect(paths).toEqual(expect.arrayContaining(['severity', 'concern', 'instead']));
    expect(flagInputSchema.safeParse({ target: { noteId: 3 }, severity: 'caution', hazard: 'other', concern: 'abc', instead: 'def' }).success).toBe(true);
    expect(flagInputSchema.safeParse({ target: { noteId: 3, recordId: 4 }, severity: 'caution', hazard: 'other', concern: 'abc', instead: 'def' }).success).toBe(false);
    expect(flagResolveSchema.safeParse({ answer: '  ', version: 1 }).success).toBe(false);
  });
});

describe('flagRaisedMail', () => {
  const input = {
    builderName: 'Edda Renwick',
    mentorName: 'Agnes Farrow',
    projectTitle: 'Cast-iron backplate',
    flaggedItem: 'Turning the spigot toward size',
    severity: 'Warning',
    severityMeaning: 'Change how this is done before doing it again.',
    hazard: 'Rotating work and chucks',
    concern: 'The plate may not be seated on the spindle shoulder.',
    instead: 'Seat it, take the key out, start slow and stand clear.',
    flagUrl: 'https://scribeline.test/projects/backplate/entries/3/edit#flag-1',
  };

  it('says the severity in words, the hazard, the concern, what to do instead, the link and the safety line', () => {
    const m = flagRaisedMail(input);
    expect(m.subject).toBe('Warning: Agnes Farrow flagged a risk on “Turning the spigot toward size”');
    expect(m.text).toContain('Severity: Warning. Change how this is done before doing it again.');
    expect(m.text).toContain('Hazard: Rotating work and chucks');
    expect(m.text).toContain(input.concern);
    expect(m.text).toContain(input.instead);
    expect(m.text).toContain(input.flagUrl);
    expect(m.text).toContain(SAFETY_LINE);
    expect(m.html).toContain(`href="${escapeHtml(input.flagUrl)}"`);
    // The mail asks for the same two steps as the buttons on the page.
    expect(m.text).toContain('Say you have seen it, and answer it');
    expect(m.text + m.html).not.toMatch(/acknowledg|resolv/i);
  });

  it('escapes every value put into the HTML, and refuses a link that is not http(s)', () => {
    const hostile = `<script>alert('x')</script>`;
    const m = flagRaisedMail({ ...input, builderName: hostile, mentorName: hostile, projectTitle: hostile, flaggedItem: hostile, hazard: hostile, concern: hostile, instead: hostile });
    expect(m.html).not.toContain('<script');
    expect(() => flagRaisedMail({ ...input, flagUrl: 'javascript:alert(1)' })).toThrow(/flag link/);
  });
});
