'use client';

import { padPress } from '@/lib/bench/queue';

const KEYS: { key: string; label: string; name: string; className?: string }[] = [
  { key: '7', label: '7', name: '7' },
  { key: '8', label: '8', name: '8' },
  { key: '9', label: '9', name: '9' },
  { key: 'back', label: '⌫', name: 'Delete last digit' },
  { key: '4', label: '4', name: '4' },
  { key: '5', label: '5', name: '5' },
  { key: '6', label: '6', name: '6' },
  { key: '-', label: '−', name: 'Minus' },
  { key: '1', label: '1', name: '1' },
  { key: '2', label: '2', name: '2' },
  { key: '3', label: '3', name: '3' },
  { key: 'clear', label: 'C', name: 'Clear the reading' },
  { key: '0', label: '0', name: '0', className: 'col-span-2' },
  { key: '.', label: '.', name: 'Decimal point' },
];

/**
 * A numeric pad drawn on the page, so the phone's own keyboard never covers the readings: every key at
 * least 56 px tall, the digits in the usual phone order.
 */
export function NumberPad({ value, onChange, onSave, saveLabel, disabled }: { value: string; onChange: (v: string) => void; onSave: () => void; saveLabel: string; disabled?: boolean }) {
  return (
    <div className="grid grid-cols-4 gap-1.5" role="group" aria-label="Number pad">
      {KEYS.map((k) => (
        <button
          key={k.key}
          type="button"
          aria-label={k.name === k.label ? undefined : k.name}
          disabled={disabled}
          onClick={() => onChange(padPress(value, k.key))}
          className={`min-h-14 rounded-md border border-rule bg-card font-mono text-2xl font-semibold text-graphite active:bg-dye-soft disabled:opacity-50 ${k.className ?? ''}`}
        >
          {k.label}
        </button>
      ))}
      <button
        type="button"
        disabled={disabled}
        onClick={onSave}
        className="col-span-4 min-h-14 rounded-md bg-dye text-lg font-bold text-on-accent active:bg-dye-2 disabled:opacity-50"
      >
        {saveLabel}
      </button>
    </div>
  );
}
