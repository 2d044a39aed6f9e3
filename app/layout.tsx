import type { Metadata } from 'next';
import localFont from 'next/font/local';
import './globals.css';

// Typefaces ship from npm font packages: nothing is fetched at build time.
const sans = localFont({
  src: '../node_modules/@fontsource-variable/ibm-plex-sans/files/ibm-plex-sans-latin-wght-normal.woff2',
  variable: '--font-sans',
  weight: '100 700',
  display: 'swap',
});
const mono = localFont({
  src: '../node_modules/@fontsource-variable/jetbrains-mono/files/jetbrains-mono-latin-wght-normal.woff2',
  variable: '--font-mono',
  weight: '100 800',
  display: 'swap',
});

export const metadata: Metadata = {
  title: { default: 'Pulseloom', template: '%s · Pulseloom' },
  description: 'Seeded, reviewed random-timing stimulation schedules for lab rigs.',
};

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en" className={`${sans.variable} ${mono.variable}`}>
      <body className="min-h-screen">{children}</body>
    </html>
  );
}
