"use client";
// Undo and redo of wall edits: every committed edit (a drag ends, a corner is added or typed, an
// obstacle drawn) is one step; the moves inside a drag are not steps of their own.
import { useRef, useState } from "react";
import type { Room } from "@/lib/geometry/types";

export interface EditHistory {
  /** Call with the room before an edit is committed. */
  record(before: Room): void;
  undo(current: Room): Room | null;
  redo(current: Room): Room | null;
  clear(): void;
  canUndo: boolean;
  canRedo: boolean;
}

const LIMIT = 200;

export function useEditHistory(): EditHistory {
  const past = useRef<Room[]>([]);
  const future = useRef<Room[]>([]);
  const [, setTick] = useState(0);
  const bump = () => setTick((n) => n + 1);
  return {
    record(before) {
      past.current = [...past.current.slice(-(LIMIT - 1)), before];
      future.current = [];
      bump();
    },
    undo(current) {
      const previous = past.current.at(-1);
      if (!previous) return null;
      past.current = past.current.slice(0, -1);
      future.current = [...future.current, current];
      bump();
      return previous;
    },
    redo(current) {
      const next = future.current.at(-1);
      if (!next) return null;
      future.current = future.current.slice(0, -1);
      past.current = [...past.current, current];
      bump();
      return next;
    },
    clear() {
      past.current = [];
      future.current = [];
      bump();
    },
    get canUndo() {
      return past.current.length > 0;
    },
    get canRedo() {
      return future.current.length > 0;
    },
  };
}
