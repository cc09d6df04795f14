import { SafetyNote } from "@/components/ui/safety-note";

/** The one reminder the builder gives its author. */
export function BuilderCaution() {
  return (
    <SafetyNote title="Steps are carried out on heavy, powered machinery">
      <p>
        Give a safety note wherever hands go near the spline or the spindle nose, a load hangs, or an axis can
        move. Keep it short; the machine builder&apos;s manual, local codes and licensed practice come first.
      </p>
    </SafetyNote>
  );
}
