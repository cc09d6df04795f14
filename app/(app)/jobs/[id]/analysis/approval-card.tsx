import { ApproveButton } from "@/components/fit/fit-buttons";
import { ControlValuesTable } from "@/components/fit/fit-tables";
import { Card } from "@/components/ui/card";
import { SafetyNote } from "@/components/ui/safety-note";
import { approvalNote } from "@/lib/analysis/fit-view";
import { controlValues, nonConformingParameters, parameterRows } from "@/lib/fit-display";
import { formatDateTimeUtc } from "@/lib/format";
import { fitApproverRefusal } from "@/lib/policy/analyses";
import type { FitSectionProps } from "./fit-section";

/**
 * Below the shown fit: once it is approved, the values to enter in the control with their units,
 * signs and the cautions; before that, the approve button (with the results that do not conform)
 * or why this user cannot approve it now.
 */
export function ApprovalCard({ job, fits: { shown, approved }, config, user, limits }: FitSectionProps) {
  const a = shown.analysis;
  const fit = a.result.fit;
  // The approval of this fit, if it is the approved one.
  const approval = approved?.detail.analysis.id === a.id ? approved : null;
  const refusal = approvalNote(user, job, approved?.detail.analysis.id);
  const mayApprove = fitApproverRefusal(user) === null;
  return (
    <Card title={approval ? "Approved parameters: values for the control" : "Approval"}>
      {approval ? (
        <div className="space-y-4">
          <p className="text-sm text-graphite-700">
            Approved {formatDateTimeUtc(approval.approvedAt)}
            {approval.approvedBy ? ` by ${approval.approvedBy}` : ""}. Enter these in the control&apos;s
            kinematic (tool centre point) settings for this head:
          </p>
          <ControlValuesTable values={controlValues(fit, config)} />
          <div className="rounded-card border border-graphite-200 bg-graphite-50 p-4 text-sm text-graphite-800">
            <p className="font-semibold">Units and signs</p>
            <p>
              Lengths in millimetres, angles in degrees (arc seconds beside them). Each value is the head as
              measured minus the head as designed, in the machine frame (right-handed X, Y, Z; both axes at
              zero). A positive offset points the way named; a positive angle is a right-hand turn about the
              direction named. Parameters the data could not separate are left out and stay at 0. Controls
              differ in whether they take the value itself or its correction, and in their own axis names:
              check the control builder&apos;s documentation before entering anything.
            </p>
          </div>
          <SafetyNote title="Before entering values and moving the axes">
            <p>
              Entering kinematic values changes how the control moves the head. Enter them and move the axes
              only as the machine builder&apos;s manual describes: with the machine locked out while you work
              at the spindle, and at the reduced speed the manual gives for the first moves, keeping clear of
              the head&apos;s swing. Check the tool centre point on the reference sphere before cutting.
              Follow local rules and your company&apos;s procedures.
            </p>
          </SafetyNote>
        </div>
      ) : (
        <div className="space-y-3">
          <p className="text-sm text-graphite-700">
            Approving fixes this fit as the head&apos;s parameter set for the job and moves the job to
            approved; the values to enter in the control are then shown here.
          </p>
          {mayApprove ? (
            <ApproveButton
              jobId={job.id}
              analysisId={a.id}
              refusal={refusal}
              nonConforming={nonConformingParameters(parameterRows(fit, limits))}
            />
          ) : (
            <p className="text-sm text-graphite-600">{refusal}</p>
          )}
        </div>
      )}
    </Card>
  );
}
