'use client';

import { createContext, useContext, useMemo, useState, type ReactNode } from 'react';

// Where the handoff page's preview player stands, so a note can take its timecode from it ("Use
// player time"). The last player touched wins: the editor previews one clip at a time.

export type PlayerTime = { clipId: string; clipName: string; seconds: number };

type Store = { current: PlayerTime | null; report: (time: PlayerTime) => void };

const PlayerTimeContext = createContext<Store>({ current: null, report: () => {} });

export function PlayerTimeProvider({ children }: { children: ReactNode }) {
  const [current, setCurrent] = useState<PlayerTime | null>(null);
  const store = useMemo(() => ({ current, report: setCurrent }), [current]);
  return <PlayerTimeContext.Provider value={store}>{children}</PlayerTimeContext.Provider>;
}

export const usePlayerTime = () => useContext(PlayerTimeContext);
