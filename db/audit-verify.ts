/**
 * Checks the audit trail's hash chain from the first event to the last and names the first
 * broken link. Exit code 0 when intact, 1 when broken.
 *   npm run audit:verify
 */
import { db, pool } from "@/db";
import { verifyAuditChain } from "@/db/queries/audit";

if (import.meta.url === `file://${process.argv[1]}`) {
  try {
    const { checked, firstBrokenId } = await verifyAuditChain(db);
    if (firstBrokenId === null) {
      console.log(`audit trail intact: ${checked} events, every link verified`);
    } else {
      console.log(
        `audit trail BROKEN at event ${firstBrokenId} (of ${checked}): its hash or its link to the event before does not match`,
      );
      process.exitCode = 1;
    }
  } finally {
    await pool.end();
  }
}
