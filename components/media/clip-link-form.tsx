'use client';

import { useId, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useQueryClient } from '@tanstack/react-query';
import { clipLinkSchema, type ClipLinkInput, type ClipLinkValues } from '@/lib/validations/media';
import { Field, inputClass, describedBy } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { applyServerErrors, sendJson } from '@/lib/client/api-client';
import type { MediaView } from '@/lib/types/log';

/** Adds a clip that lives elsewhere: a video page on a video site, a stream, or a video file's address. */
export function ClipLinkForm({ entryId, onAdded }: { entryId: number; onAdded?: (m: MediaView) => void }) {
  const id = useId();
  const queryClient = useQueryClient();
  const [failure, setFailure] = useState<string | null>(null);
  const [added, setAdded] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError, reset } = useForm<ClipLinkValues, unknown, ClipLinkInput>({
    resolver: zodResolver(clipLinkSchema),
    defaultValues: { url: '', name: '' },
  });
  const { errors, isSubmitting } = formState;
  const urlId = `${id}-url`;
  const nameId = `${id}-name`;

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    setAdded(null);
    const res = await sendJson<{ media: MediaView }>(`/api/entries/${entryId}/media`, 'POST', { url: values.url, ...(values.name ? { name: values.name } : {}) });
    if (!res.ok) {
      applyServerErrors(res.error, setError);
      setFailure(res.error.message);
      return;
    }
    reset({ url: '', name: '' });
    setAdded(`Added “${res.data.media.name}”.`);
    await queryClient.invalidateQueries({ queryKey: ['media', entryId] });
    onAdded?.(res.data.media);
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3" aria-label="Add a clip by its link">
      {failure ? (
        <Notice kind="error" role="alert" title="Link not added">
          <p>{failure}</p>
        </Notice>
      ) : null}
      <Field id={urlId} label="Link to the video" hint="The address of a video page on a video site, or of a .mp4, .webm, .mov or .m3u8 file." error={errors.url?.message}>
        <input
          id={urlId}
          type="url"
          inputMode="url"
          autoComplete="off"
          spellCheck={false}
          placeholder="https://"
          className={inputClass}
          aria-invalid={!!errors.url}
          aria-describedby={describedBy(urlId, errors.url?.message, 'hint')}
          {...register('url')}
        />
      </Field>
      <Field id={nameId} label="Name (optional)" hint="Shown in the log; the site’s name is used if left empty." error={errors.name?.message}>
        <input id={nameId} className={inputClass} aria-invalid={!!errors.name} aria-describedby={describedBy(nameId, errors.name?.message, 'hint')} {...register('name')} />
      </Field>
      <Button type="submit" tone="quiet" className="min-h-12" disabled={isSubmitting}>
        {isSubmitting ? 'Adding…' : 'Add link'}
      </Button>
      {added ? (
        <Notice kind="success" role="status">
          {added}
        </Notice>
      ) : null}
    </form>
  );
}
