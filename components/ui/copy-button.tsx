'use client';

import { useState } from 'react';
import { Button, type ButtonProps } from './button';

/** Copies `text` to the clipboard and says so in words (announced politely). */
export function CopyButton({ text, label = 'Copy', ...rest }: Omit<ButtonProps, 'onClick'> & { text: string; label?: string }) {
  const [state, setState] = useState<'idle' | 'copied' | 'failed'>('idle');
  async function copy() {
    try {
      await navigator.clipboard.writeText(text);
      setState('copied');
    } catch {
      // Clipboard access can be refused (insecure origin, permissions): the text stays selectable.
      setState('failed');
    }
  }
  return (
    <span className="inline-flex items-center gap-2">
      <Button variant="secondary" size="sm" onClick={copy} {...rest}>
        {label}
      </Button>
      <span aria-live="polite" className="text-xs text-paper-600">
        {state === 'copied' ? 'Copied' : state === 'failed' ? 'Could not copy: select the text and copy it' : ''}
      </span>
    </span>
  );
}
