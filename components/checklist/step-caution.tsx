"use client";

import { useSyncExternalStore } from "react";
import { SafetyNote } from "@/components/ui/safety-note";

const key = (id: string) => `trammel:caution-read:${id}`;
const listeners = new Set<() => void>();
const subscribe = (l: () => void) => {
  listeners.add(l);
  return () => listeners.delete(l);
};

/**
 * A step's caution, once per step. Where the step is hazardous (a suspended load, a running
 * spindle) it is always shown in full; elsewhere it is a compact note the installer may fold to
 * one line for the rest of this browser session, and open again.
 */
export function StepCaution({
  id,
  title,
  text,
  severe,
}: {
  id: string;
  title: string;
  text: string;
  severe: boolean;
}) {
  const folded = useSyncExternalStore(
    subscribe,
    () => sessionStorage.getItem(key(id)) === "1",
    () => false,
  );
  if (severe)
    return (
      <SafetyNote title={title}>
        <p>{text}</p>
      </SafetyNote>
    );
  const toggle = () => {
    if (folded) sessionStorage.removeItem(key(id));
    else sessionStorage.setItem(key(id), "1");
    listeners.forEach((l) => l());
  };
  return (
    <aside
      role="note"
      aria-label={`Safety: ${title}`}
      className="flex items-start gap-2 rounded-md border border-accent-500 bg-accent-50 px-3 py-2 text-sm text-graphite-900"
    >
      <span aria-hidden="true" className="font-bold text-accent-700">
        ⚠
      </span>
      <p className="flex-1">
        <span className="font-semibold">{title}.</span> {folded ? null : text}
      </p>
      <button type="button" onClick={toggle} className="min-h-touch shrink-0 px-2 font-medium underline">
        {folded ? "Show" : "Fold"}
      </button>
    </aside>
  );
}
