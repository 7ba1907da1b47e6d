import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { cache } from 'react';
import { getCurrentUser } from '@/lib/auth/current-user';
import { loadSessionSheet } from '@/lib/server/sheets';
import { idOrNotFound, orNotFound } from '@/lib/http/page';
import { AppError } from '@/lib/errors';
import { Notice } from '@/components/ui/notice';
import { Button } from '@/components/ui/button';
import { ShopSheet } from '@/components/sheets/shop-sheet';
import { PrintButton } from '@/components/sheets/print-button';

// Reads the session (the sheet is for the builder's circle): rendered per request.
export const instant = false;

type Search = { records?: string | string[]; paper?: string };
type Props = { params: Promise<{ slug: string; sessionId: string }>; searchParams: Promise<Search> };

const PAPER = { a4: { css: 'A4 portrait', label: 'A4' }, letter: { css: 'letter portrait', label: 'Letter' } } as const;
type Paper = keyof typeof PAPER;

// Once per request, for the title and the page. A refusal other than "not there" is shown, not thrown.
const load = cache(async (slug: string, sessionId: string, records: string | string[] | undefined) => {
  const id = idOrNotFound(sessionId);
  const user = await getCurrentUser();
  try {
    const sheet = await orNotFound(loadSessionSheet(user, id, records ?? null));
    if (sheet.project.slug !== slug) notFound();
    return { sheet, user, refusal: null };
  } catch (err) {
    if (err instanceof AppError && (err.code === 'forbidden' || err.code === 'validation')) return { sheet: null, user, refusal: err };
    throw err;
  }
});

export async function generateMetadata({ params, searchParams }: Props): Promise<Metadata> {
  const { slug, sessionId } = await params;
  const { records } = await searchParams;
  const { sheet } = await load(slug, sessionId, records);
  return { title: sheet ? `Shop sheet · ${sheet.session.title}` : 'Shop sheet', robots: { index: false } };
}

export default async function ShopSheetPage({ params, searchParams }: Props) {
  const { slug, sessionId } = await params;
  const { records, paper: paperParam } = await searchParams;
  const { sheet, user, refusal } = await load(slug, sessionId, records);
  const readerHref = `/logs/${slug}/sessions/${sessionId}`;
  if (!sheet) {
    return (
      <div className="space-y-4">
        <h1 className="text-2xl font-bold">Shop sheet</h1>
        <Notice kind="error" title={refusal?.code === 'validation' ? 'That choice of records cannot be printed' : 'Not your sheet to print'}>
          {refusal?.message}{' '}
          {refusal?.code === 'validation' ? <Link href={`/projects/${slug}/sessions/${sessionId}/sheet`}>Print every record of the session</Link> : <Link href={readerHref}>Read the session instead</Link>}.
        </Notice>
      </div>
    );
  }
  const paper: Paper = paperParam === 'letter' || paperParam === 'a4' ? paperParam : sheet.project.units === 'in' ? 'letter' : 'a4';
  const chosen = new Set(sheet.chosen ?? sheet.allRecords.map((r) => r.id));
  return (
    <div className="space-y-4">
      {/* The page's own paper size; the margins are the site's print default (app/globals.css). */}
      <style>{`@page { size: ${PAPER[paper].css}; }`}</style>
      <div className="space-y-3 print:hidden">
        <nav aria-label="Breadcrumb" className="text-sm">
          <Link href={`/projects/${slug}/log`}>Build log</Link> <span aria-hidden="true">›</span> <Link href={readerHref}>Session {sheet.session.position + 1}</Link>{' '}
          <span aria-hidden="true">›</span> Shop sheet
        </nav>
        <form method="get" className="flex flex-wrap items-end gap-x-6 gap-y-3 rounded-lg border border-rule bg-paper-2 p-4" aria-label="What the sheet holds">
          <fieldset>
            <legend className="text-sm font-bold">Paper</legend>
            <div className="mt-1 flex gap-4">
              {(Object.keys(PAPER) as Paper[]).map((p) => (
                <label key={p} className="flex min-h-11 items-center gap-2">
                  <input type="radio" name="paper" value={p} defaultChecked={p === paper} className="h-5 w-5" />
                  {PAPER[p].label}
                </label>
              ))}
            </div>
          </fieldset>
          {sheet.allRecords.length ? (
            <fieldset>
              <legend className="text-sm font-bold">Records on the sheet</legend>
              <div className="mt-1 flex flex-wrap gap-x-4">
                {sheet.allRecords.map((r) => (
                  <label key={r.id} className="flex min-h-11 items-center gap-2">
                    <input type="checkbox" name="records" value={r.id} defaultChecked={chosen.has(r.id)} className="h-5 w-5" />
                    {r.feature}
                  </label>
                ))}
              </div>
            </fieldset>
          ) : null}
          <Button type="submit" tone="quiet">
            Update the sheet
          </Button>
          <PrintButton />
        </form>
      </div>
      <ShopSheet sheet={sheet} printedFor={user?.name ?? 'the builder'} />
    </div>
  );
}
