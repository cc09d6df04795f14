"use client";

import { createContext, useContext, useEffect, useState } from "react";
import { DecisionBadge } from "@/components/readings/decision-badge";
import { LocalTime } from "@/components/readings/local-time";
import { useReadingQueue } from "@/components/readings/queue-provider";
import type { StepDecision } from "@/lib/checklist";

export interface StepLine {
  position: number;
  stepId: string;
  title: string;
  decision: StepDecision;
  /** The step's current result: value, who, when; null when not measured. */
  value: string | null;
  by: string | null;
  at: string | null;
}

const OpenStep = createContext<{ open: number | null; setOpen: (p: number | null) => void }>({
  open: null,
  setOpen: () => {},
});

const fromHash = () => {
  const m = /^#step-(\d+)$/.exec(window.location.hash);
  return m ? Number(m[1]) : null;
};

/** One step open at a time; the jump list and #step-N links open the step they name. */
export function StepAccordion({ first, children }: { first: number | null; children: React.ReactNode }) {
  const [open, setOpen] = useState<number | null>(first);
  useEffect(() => {
    const onHash = () => {
      const p = fromHash();
      if (p != null) setOpen(p);
    };
    window.addEventListener("hashchange", onHash);
    const t = setTimeout(onHash, 0);
    return () => {
      clearTimeout(t);
      window.removeEventListener("hashchange", onHash);
    };
  }, []);
  return <OpenStep.Provider value={{ open, setOpen }}>{children}</OpenStep.Provider>;
}

function Waiting({ stepId }: { stepId: string }) {
  const n = useReadingQueue().items.filter((q) => q.body.stepId === stepId).length;
  return n ? (
    <span className="whitespace-nowrap rounded bg-accent-100 px-2 py-0.5 text-xs font-semibold text-graphite-900">
      {n} on this tablet
    </span>
  ) : null;
}

/** The step summary at the top of the checklist: a status chip per step that jumps to it. */
export function StepJumpList({ lines }: { lines: StepLine[] }) {
  const { setOpen } = useContext(OpenStep);
  return (
    <nav aria-label="Steps" className="rounded-card border border-graphite-200 bg-white p-3">
      <ol className="grid gap-2 sm:grid-cols-2 lg:grid-cols-3">
        {lines.map((l) => (
          <li key={l.position}>
            <a
              href={`#step-${l.position}`}
              onClick={() => setOpen(l.position)}
              className="flex min-h-touch items-center gap-2 rounded-md px-2 py-1 hover:bg-graphite-50"
            >
              <span className="num w-5 shrink-0 text-right font-semibold text-graphite-600">
                {l.position}
              </span>
              <span className="min-w-0 flex-1 truncate text-sm">{l.title}</span>
              <DecisionBadge decision={l.decision} />
              <Waiting stepId={l.stepId} />
            </a>
          </li>
        ))}
      </ol>
    </nav>
  );
}

/** A step collapsed to one line (value, result, who, when), or open with its details and form. */
export function StepShell({ line, children }: { line: StepLine; children: React.ReactNode }) {
  const { open, setOpen } = useContext(OpenStep);
  const isOpen = open === line.position;
  return (
    <li
      id={`step-${line.position}`}
      className="scroll-mt-4 rounded-card border border-graphite-200 bg-white shadow-sm"
      data-testid={`step-${line.position}`}
    >
      <h3>
        <button
          type="button"
          aria-expanded={isOpen}
          aria-controls={`step-body-${line.position}`}
          onClick={() => setOpen(isOpen ? null : line.position)}
          className="flex min-h-touch w-full flex-wrap items-center gap-x-3 gap-y-1 px-4 py-3 text-left"
        >
          <span aria-hidden="true" className="text-graphite-500">
            {isOpen ? "▲" : "▼"}
          </span>
          <span className="num text-sm text-graphite-500">Step {line.position}</span>
          <span className="min-w-0 flex-1 basis-64 text-base font-semibold">{line.title}</span>
          {line.value ? <span className="num font-semibold">{line.value}</span> : null}
          <DecisionBadge decision={line.decision} />
          {line.by ? <span className="text-sm text-graphite-600">{line.by}</span> : null}
          {line.at ? (
            <span className="text-sm text-graphite-600">
              <LocalTime at={line.at} />
            </span>
          ) : null}
          <Waiting stepId={line.stepId} />
        </button>
      </h3>
      <div id={`step-body-${line.position}`} hidden={!isOpen} className="border-t border-graphite-100">
        {children}
      </div>
    </li>
  );
}
