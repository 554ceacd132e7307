'use client';
// Whose drafts a register keeps: the signed-in user, set once by the project's layout so that
// every register tab below it keeps drafts apart per user (two people may share a browser).
import { createContext, useContext, type ReactNode } from 'react';

const DraftOwner = createContext<number | null>(null);

export function DraftOwnerProvider({ userId, children }: { userId: number; children: ReactNode }) {
  return <DraftOwner.Provider value={userId}>{children}</DraftOwner.Provider>;
}

/** The user whose drafts are kept, or null outside a project (drafts then live in the page only). */
export function useDraftOwner(): number | null {
  return useContext(DraftOwner);
}
