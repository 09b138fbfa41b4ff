'use client';

import { createContext, useContext, type ReactNode } from 'react';
import type { Role } from '@/lib/auth/policy';

/** Who is looking at this channel, handed down once by the channel layout; the server still decides every request. */
export type Viewer = { role: Role; userId: string };

const ViewerContext = createContext<Viewer | null>(null);

export function ViewerProvider({ viewer, children }: { viewer: Viewer; children: ReactNode }) {
  return <ViewerContext.Provider value={viewer}>{children}</ViewerContext.Provider>;
}

/** Every channel page sits inside the channel layout, which provides the viewer. */
export function useViewer(): Viewer {
  const viewer = useContext(ViewerContext);
  if (!viewer) throw new Error('useViewer outside a channel page: the channel layout provides it');
  return viewer;
}
