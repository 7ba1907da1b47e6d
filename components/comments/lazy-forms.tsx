'use client';

import dynamic from 'next/dynamic';
import { FormLoading } from '@/components/forms/form-loading';

// The comment forms and their validation (react-hook-form, zod) load when a form is shown: a signed-out
// reader of an entry, most of its readers, never loads them.

export const CommentForm = dynamic(() => import('./comment-form').then((m) => m.CommentForm), { loading: FormLoading });
export const ReportCommentForm = dynamic(() => import('./report-comment').then((m) => m.ReportCommentForm), { loading: FormLoading });
export const HideCommentForm = dynamic(() => import('./hide-comment-form').then((m) => m.HideCommentForm), { loading: FormLoading });
