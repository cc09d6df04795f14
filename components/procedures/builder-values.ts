/**
 * The procedure builder's form values (every field a string or a boolean, points as "12, 3, 6, 9")
 * and how a new or stored procedure fills them. A plain module, so server pages can build the
 * initial values that the client builder (procedure-builder.tsx) edits.
 */
import { HEAD_PARAMETER_KEYS, type HeadParameterKey } from "@/geometry/head/config";
import { HEAD_AXIS_ROLES, POSITIONING_QUANTITIES, type HeadAxisRole } from "@/lib/domain/positioning";
import { CLOCK_POINTS_4 } from "@/lib/domain/procedures";

/** One step as the form holds it: every field a string or a boolean, points as "12, 3, 6, 9". */
export interface BuilderStep {
  title: string;
  kind: string;
  instructions: string;
  safety: string;
  quantity: string;
  unit: string;
  lower: string;
  upper: string;
  decisionRule: string;
  limitSource: string;
  limitSourceNote: string;
  points: string;
  pointResult: string;
  distanceMm: string;
  recordUnit: string;
  photoRequired: boolean;
}

export interface BuilderValues extends BuilderHeadJudging {
  name: string;
  description: string;
  jobKinds: string[];
  headModel: string;
  steps: BuilderStep[];
}

/** A new procedure's form: one empty step, no TCP check, no parameter or positioning limits. */
export const emptyBuilderValues = (): BuilderValues => ({
  name: "",
  description: "",
  jobKinds: [],
  headModel: "",
  steps: [{ ...EMPTY_STEP }],
  ...headJudgingValues(null),
});

export const EMPTY_STEP: BuilderStep = {
  title: "",
  kind: "direct",
  instructions: "",
  safety: "",
  quantity: "",
  unit: "mm",
  lower: "",
  upper: "",
  decisionRule: "simple",
  limitSource: "",
  limitSourceNote: "",
  points: CLOCK_POINTS_4.join(", "),
  pointResult: "tir",
  distanceMm: "",
  recordUnit: "",
  photoRequired: false,
};

/** One fitted parameter's limit as the form holds it (strings; both limits empty = recorded only). */
export interface BuilderParameterLimit {
  parameter: HeadParameterKey;
  lower: string;
  upper: string;
  decisionRule: string;
  limitSource: string;
  limitSourceNote: string;
}

/** One ISO 230-2 quantity of one rotary axis as the form holds it (an empty limit = recorded only). */
export interface BuilderPositioningLimit {
  axis: HeadAxisRole;
  quantity: string;
  upper: string;
  limitSource: string;
  limitSourceNote: string;
}

export interface BuilderHeadJudging {
  tcpCheckRequired: boolean;
  tcpRangeLimitUm: string;
  tcpDeviationLimitUm: string;
  tcpLimitSource: string;
  tcpLimitSourceNote: string;
  parameterLimits: BuilderParameterLimit[];
  /** Every axis × quantity, primary first, in the order of POSITIONING_QUANTITIES. */
  positioningLimits: BuilderPositioningLimit[];
}

const str = (v: string | number | null | undefined) => (v == null ? "" : String(v));

/**
 * The form values from what a version stores (every parameter, and every quantity of each rotary
 * axis, gets a row, limited or not).
 */
export function headJudgingValues(
  t: {
    tcpCheckRequired: boolean;
    tcpRangeLimitUm: number | null;
    tcpDeviationLimitUm: number | null;
    tcpLimitSource: string | null;
    tcpLimitSourceNote: string | null;
    parameterLimits: {
      parameter: string;
      lowerLimit: number | null;
      upperLimit: number | null;
      decisionRule: string;
      limitSource: string;
      limitSourceNote: string | null;
    }[];
    positioningLimits: {
      axis: string;
      quantity: string;
      upperLimitArcsec: number;
      limitSource: string;
      limitSourceNote: string | null;
    }[];
  } | null,
): BuilderHeadJudging {
  return {
    tcpCheckRequired: t?.tcpCheckRequired ?? false,
    tcpRangeLimitUm: str(t?.tcpRangeLimitUm),
    tcpDeviationLimitUm: str(t?.tcpDeviationLimitUm),
    tcpLimitSource: str(t?.tcpLimitSource),
    tcpLimitSourceNote: str(t?.tcpLimitSourceNote),
    parameterLimits: HEAD_PARAMETER_KEYS.map((parameter) => {
      const l = t?.parameterLimits.find((x) => x.parameter === parameter);
      return {
        parameter,
        lower: str(l?.lowerLimit),
        upper: str(l?.upperLimit),
        decisionRule: l?.decisionRule ?? "simple",
        limitSource: str(l?.limitSource),
        limitSourceNote: str(l?.limitSourceNote),
      };
    }),
    positioningLimits: HEAD_AXIS_ROLES.flatMap((axis) =>
      POSITIONING_QUANTITIES.map((quantity) => {
        const l = t?.positioningLimits.find((x) => x.axis === axis && x.quantity === quantity);
        return {
          axis,
          quantity,
          upper: str(l?.upperLimitArcsec),
          limitSource: str(l?.limitSource),
          limitSourceNote: str(l?.limitSourceNote),
        };
      }),
    ),
  };
}

/** The axis letters of the heads of one model in the register (one row per distinct pair). */
export interface HeadModelAxes {
  model: string;
  primaryAxis: string;
  secondaryAxis: string;
}

/**
 * The axis letters the builder can name for a procedure's head model: those of the register's
 * heads of that model (compared trimmed and case-blind, as the procedure list filters), when they
 * all agree; null for no model, an unknown model, or heads of one model with different letters.
 */
export function axisLettersFor(
  heads: readonly HeadModelAxes[],
  headModel: string | null | undefined,
): Record<HeadAxisRole, string> | null {
  const key = headModel?.trim().toLowerCase();
  if (!key) return null;
  const pairs = new Set(
    heads
      .filter((h) => h.model.trim().toLowerCase() === key)
      .map((h) => `${h.primaryAxis}/${h.secondaryAxis}`),
  );
  if (pairs.size !== 1) return null;
  const [primary, secondary] = [...pairs][0]!.split("/") as [string, string];
  return { primary, secondary };
}
