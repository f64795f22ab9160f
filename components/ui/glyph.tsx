import { cx } from './cx';

// Small shapes that carry meaning together with a word, so nothing depends on colour alone.
export type GlyphShape = 'diamond' | 'target' | 'triangle' | 'ring' | 'check' | 'cross' | 'bang' | 'dot';

export function Glyph({ shape, className }: { shape: GlyphShape; className?: string }) {
  return (
    <svg viewBox="0 0 12 12" className={cx('h-3 w-3 shrink-0', className)} aria-hidden="true" focusable="false">
      {shape === 'diamond' && <path d="M6 0.8 L11.2 6 L6 11.2 L0.8 6 Z" fill="currentColor" />}
      {shape === 'target' && (
        <>
          <circle cx="6" cy="6" r="4.6" fill="none" stroke="currentColor" strokeWidth="1.5" />
          <circle cx="6" cy="6" r="2" fill="currentColor" />
        </>
      )}
      {shape === 'triangle' && <path d="M6 1.2 L11 10.4 H1 Z" fill="currentColor" />}
      {shape === 'ring' && <circle cx="6" cy="6" r="4.4" fill="none" stroke="currentColor" strokeWidth="1.5" />}
      {shape === 'check' && (
        <path d="M1.8 6.4 L4.8 9.2 L10.4 2.8" fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" strokeLinejoin="round" />
      )}
      {shape === 'cross' && (
        <path d="M2.5 2.5 L9.5 9.5 M9.5 2.5 L2.5 9.5" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" />
      )}
      {shape === 'bang' && (
        <>
          <path d="M6 1.5 V7.2" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
          <circle cx="6" cy="10" r="1.1" fill="currentColor" />
        </>
      )}
      {shape === 'dot' && <circle cx="6" cy="6" r="2.6" fill="currentColor" />}
    </svg>
  );
}
