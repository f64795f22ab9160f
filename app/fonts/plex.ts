import localFont from 'next/font/local';

// IBM Plex ships with the app from @fontsource (nothing is fetched at run time).
export const plexSans = localFont({
  variable: '--font-plex-sans',
  display: 'swap',
  src: [
    { path: '../../node_modules/@fontsource/ibm-plex-sans/files/ibm-plex-sans-latin-400-normal.woff2', weight: '400', style: 'normal' },
    { path: '../../node_modules/@fontsource/ibm-plex-sans/files/ibm-plex-sans-latin-400-italic.woff2', weight: '400', style: 'italic' },
    { path: '../../node_modules/@fontsource/ibm-plex-sans/files/ibm-plex-sans-latin-500-normal.woff2', weight: '500', style: 'normal' },
    { path: '../../node_modules/@fontsource/ibm-plex-sans/files/ibm-plex-sans-latin-600-normal.woff2', weight: '600', style: 'normal' },
    { path: '../../node_modules/@fontsource/ibm-plex-sans/files/ibm-plex-sans-latin-700-normal.woff2', weight: '700', style: 'normal' },
  ],
});

// A separate family so the browser falls back to it per glyph (Γ, Δ, Σ in zone labels).
export const plexGreek = localFont({
  variable: '--font-plex-greek',
  display: 'swap',
  preload: false,
  src: [
    { path: '../../node_modules/@fontsource/ibm-plex-sans/files/ibm-plex-sans-greek-400-normal.woff2', weight: '400', style: 'normal' },
    { path: '../../node_modules/@fontsource/ibm-plex-sans/files/ibm-plex-sans-greek-600-normal.woff2', weight: '600', style: 'normal' },
  ],
});

export const plexMono = localFont({
  variable: '--font-plex-mono',
  display: 'swap',
  preload: false,
  src: [
    { path: '../../node_modules/@fontsource/ibm-plex-mono/files/ibm-plex-mono-latin-400-normal.woff2', weight: '400', style: 'normal' },
    { path: '../../node_modules/@fontsource/ibm-plex-mono/files/ibm-plex-mono-latin-500-normal.woff2', weight: '500', style: 'normal' },
  ],
});
