'use client';

import { useRef, useState, useSyncExternalStore, type KeyboardEvent as ReactKeyboardEvent, type ReactNode } from 'react';
import { useEditorState, type Editor } from '@tiptap/react';

const noSubscribe = () => () => {};
/** "⌘" on Apple keyboards, else "Ctrl"; "Ctrl" during server rendering and hydration. */
export function useModKey(): string {
  return useSyncExternalStore(
    noSubscribe,
    () => (/Mac|iPhone|iPad/.test(navigator.platform || navigator.userAgent) ? '⌘' : 'Ctrl'),
    () => 'Ctrl',
  );
}


type Tool = {
  key: string;
  label: string;
  shortcut?: string;
  keys?: string;
  icon: ReactNode;
  text?: string;
  active?: boolean;
  disabled?: boolean;
  run: () => void;
  group: number;
};

/** The formatting tools above the entry text, one roving-focus toolbar. */
export function Toolbar({ editor, onLink, onPhoto, photosControls }: { editor: Editor | null; onLink: () => void; onPhoto: () => void; photosControls: string }) {
  const s = useEditorState({
    editor: editor as Editor,
    selector: ({ editor: e }) =>
      e
        ? {
            h2: e.isActive('heading', { level: 2 }),
            h3: e.isActive('heading', { level: 3 }),
            bold: e.isActive('bold'),
            italic: e.isActive('italic'),
            strike: e.isActive('strike'),
            bulletList: e.isActive('bulletList'),
            orderedList: e.isActive('orderedList'),
            blockquote: e.isActive('blockquote'),
            code: e.isActive('code'),
            codeBlock: e.isActive('codeBlock'),
            link: e.isActive('link'),
            canUndo: e.can().undo(),
            canRedo: e.can().redo(),
          }
        : null,
  });
  const [tabStop, setTabStop] = useState('h2');
  const bar = useRef<HTMLDivElement>(null);
  const mod = useModKey();
  const k = mod === '⌘' ? 'Meta' : 'Control';
  const c = () => editor!.chain().focus();

  const tools: Tool[] = [
    { key: 'h2', group: 0, label: 'H2 heading', shortcut: `${mod}+Alt+2`, keys: `${k}+Alt+2`, icon: <b>H2</b>, active: s?.h2, run: () => c().toggleHeading({ level: 2 }).run() },
    { key: 'h3', group: 0, label: 'H3 subheading', shortcut: `${mod}+Alt+3`, keys: `${k}+Alt+3`, icon: <b>H3</b>, active: s?.h3, run: () => c().toggleHeading({ level: 3 }).run() },
    { key: 'bold', group: 1, label: 'Bold', shortcut: `${mod}+B`, keys: `${k}+B`, icon: <b className="text-base">B</b>, active: s?.bold, run: () => c().toggleBold().run() },
    { key: 'italic', group: 1, label: 'Italic', shortcut: `${mod}+I`, keys: `${k}+I`, icon: <i className="font-serif text-base">I</i>, active: s?.italic, run: () => c().toggleItalic().run() },
    { key: 'strike', group: 1, label: 'Strike through', shortcut: `${mod}+Shift+S`, keys: `${k}+Shift+S`, icon: <s className="text-base">S</s>, active: s?.strike, run: () => c().toggleStrike().run() },
    { key: 'code', group: 1, label: 'Inline code', shortcut: `${mod}+E`, keys: `${k}+E`, icon: <IconCode />, active: s?.code, run: () => c().toggleCode().run() },
    { key: 'link', group: 1, label: 'Link', shortcut: `${mod}+K`, keys: `${k}+K`, icon: <IconLink />, active: s?.link, run: onLink },
    { key: 'bulletList', group: 2, label: 'Bulleted list', shortcut: `${mod}+Shift+8`, keys: `${k}+Shift+8`, icon: <IconBullets />, active: s?.bulletList, run: () => c().toggleBulletList().run() },
    { key: 'orderedList', group: 2, label: 'Numbered list', shortcut: `${mod}+Shift+7`, keys: `${k}+Shift+7`, icon: <IconNumbers />, active: s?.orderedList, run: () => c().toggleOrderedList().run() },
    { key: 'blockquote', group: 2, label: 'Quote', shortcut: `${mod}+Shift+B`, keys: `${k}+Shift+B`, icon: <IconQuote />, active: s?.blockquote, run: () => c().toggleBlockquote().run() },
    { key: 'codeBlock', group: 2, label: 'Code block', shortcut: `${mod}+Alt+C`, keys: `${k}+Alt+C`, icon: <IconCodeBlock />, active: s?.codeBlock, run: () => c().toggleCodeBlock().run() },
    { key: 'photo', group: 3, label: 'Photo', icon: <IconPhoto />, text: 'Photo', run: onPhoto },
    { key: 'undo', group: 4, label: 'Undo', shortcut: `${mod}+Z`, keys: `${k}+Z`, icon: <IconUndo />, disabled: !s?.canUndo, run: () => c().undo().run() },
    { key: 'redo', group: 4, label: 'Redo', shortcut: `${mod}+Shift+Z`, keys: `${k}+Shift+Z`, icon: <IconRedo />, disabled: !s?.canRedo, run: () => c().redo().run() },
  ];
  const enabled = tools.filter((t) => !t.disabled);
  const stop = enabled.some((t) => t.key === tabStop) ? tabStop : enabled[0].key;

  // One tab stop for the whole bar; arrow keys move along it (WAI-ARIA toolbar pattern).
  const onKeyDown = (event: ReactKeyboardEvent<HTMLDivElement>) => {
    if (!['ArrowLeft', 'ArrowRight', 'Home', 'End'].includes(event.key)) return;
    const buttons = Array.from(bar.current?.querySelectorAll<HTMLButtonElement>('button[data-tool]:not(:disabled)') ?? []);
    const at = buttons.indexOf(document.activeElement as HTMLButtonElement);
    if (at < 0) return;
    event.preventDefault();
    const next =
      event.key === 'Home' ? 0 : event.key === 'End' ? buttons.length - 1 : (at + (event.key === 'ArrowRight' ? 1 : -1) + buttons.length) % buttons.length;
    buttons[next].focus();
  };

  return (
    <div
      ref={bar}
      role="toolbar"
      aria-label="Formatting"
      onKeyDown={onKeyDown}
      className="flex flex-wrap items-center gap-0.5"
    >
      {tools.map((tool, i) => (
        <span key={tool.key} className="contents">
          {i > 0 && tools[i - 1].group !== tool.group ? <span aria-hidden="true" className="mx-0.5 h-6 w-px bg-rule" /> : null}
          <button
            type="button"
            data-tool={tool.key}
            tabIndex={tool.key === stop ? 0 : -1}
            onFocus={() => setTabStop(tool.key)}
            onMouseDown={(e) => e.preventDefault()}
            onClick={() => editor && tool.run()}
            disabled={!editor || tool.disabled}
            aria-label={tool.label}
            aria-pressed={tool.active === undefined ? undefined : Boolean(tool.active)}
            aria-keyshortcuts={tool.keys}
            aria-haspopup={tool.key === 'photo' ? 'dialog' : undefined}
            aria-controls={tool.key === 'photo' ? photosControls : undefined}
            title={tool.shortcut ? `${tool.label} (${tool.shortcut})` : tool.label}
            className="inline-flex h-10 min-w-10 items-center justify-center gap-1 rounded-md px-2 text-sm text-graphite hover:bg-paper-2 disabled:opacity-40 aria-pressed:bg-dye aria-pressed:text-on-accent"
          >
            <span aria-hidden="true" className="inline-flex items-center">
              {tool.icon}
            </span>
            {tool.text ? (
              <span aria-hidden="true" className="hidden sm:inline">
                {tool.text}
              </span>
            ) : null}
          </button>
        </span>
      ))}
    </div>
  );
}

// Our own small line icons, drawn on a 20-unit grid.
function Svg({ children }: { children: ReactNode }) {
  return (
    <svg viewBox="0 0 20 20" width="20" height="20" fill="none" stroke="currentColor" strokeWidth="1.7" strokeLinecap="round" strokeLinejoin="round">
      {children}
    </svg>
  );
}
const IconCode = () => (
  <Svg>
    <path d="M7 6 3 10l4 4M13 6l4 4-4 4" />
  </Svg>
);
const IconCodeBlock = () => (
  <Svg>
    <rect x="2.5" y="3.5" width="15" height="13" rx="1.5" />
    <path d="m7 8-2 2 2 2M13 8l2 2-2 2" />
  </Svg>
);
const IconLink = () => (
  <Svg>
    <path d="M8.5 11.5a3 3 0 0 0 4.2 0l2.6-2.6a3 3 0 0 0-4.2-4.2l-.9.9" />
    <path d="M11.5 8.5a3 3 0 0 0-4.2 0l-2.6 2.6a3 3 0 0 0 4.2 4.2l.9-.9" />
  </Svg>
);
const IconBullets = () => (
  <Svg>
    <circle cx="4" cy="5.5" r="0.9" fill="currentColor" />
    <circle cx="4" cy="10" r="0.9" fill="currentColor" />
    <circle cx="4" cy="14.5" r="0.9" fill="currentColor" />
    <path d="M8 5.5h9M8 10h9M8 14.5h9" />
  </Svg>
);
const IconNumbers = () => (
  <Svg>
    <path d="M3 4h1.5v4M3 8h3M3 12.5c0-.8.6-1.3 1.4-1.3s1.4.5 1.4 1.2c0 1.3-2.8 1.6-2.8 3.1h2.8M9 5.5h8M9 10h8M9 14.5h8" strokeWidth="1.4" />
  </Svg>
);
const IconQuote = () => (
  <Svg>
    <path d="M4 4v12" strokeWidth="2.4" />
    <path d="M8.5 6.5h8M8.5 10h8M8.5 13.5h5" />
  </Svg>
);
const IconPhoto = () => (
  <Svg>
    <rect x="2.5" y="4" width="15" height="12" rx="1.5" />
    <circle cx="7" cy="8.2" r="1.4" />
    <path d="m3 15 4.5-4.5 3 3 2.5-2.5 4.5 4.5" />
  </Svg>
);
const IconUndo = () => (
  <Svg>
    <path d="M7 5 3.5 8.5 7 12" />
    <path d="M3.5 8.5H12a4.5 4.5 0 0 1 0 9H9" />
  </Svg>
);
const IconRedo = () => (
  <Svg>
    <path d="m13 5 3.5 3.5L13 12" />
    <path d="M16.5 8.5H8a4.5 4.5 0 0 0 0 9h3" />
  </Svg>
);
