import type { Metadata, Viewport } from 'next';
import type { ReactNode } from 'react';
import { QueryProvider } from '@/components/providers/query-provider';
import { monoFont, uiFont } from './fonts';
import './globals.css';

export const metadata: Metadata = {
  title: { default: 'Kerfline', template: '%s · Kerfline' },
  description: 'Production planning for woodworking videos: running order, scripts, shots, cut plans and clips.',
};

export const viewport: Viewport = { width: 'device-width', initialScale: 1, themeColor: '#f7f2e8' };

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en" className={`${uiFont.variable} ${monoFont.variable}`}>
      <body>
        <QueryProvider>{children}</QueryProvider>
      </body>
    </html>
  );
}
