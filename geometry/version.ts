/**
 * Version of the computation. Stored beside every analysis so a result can be traced to the code
 * that produced it, and a change of the head model or fit (bump this) makes a re-run a new
 * analysis rather than a silent re-use of the old one.
 */
export const GEOMETRY_VERSION = "head-fit-1.0.0";
