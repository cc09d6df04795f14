"use client";

import { ActionNotice, Button } from "@/components/ui/button";
import { useActionButton } from "@/components/ui/use-action-button";
import type { ActionResult } from "@/lib/actions";

/** Retire a procedure (no longer offered for new jobs; its jobs keep it) or bring it back. */
export function RetireProcedureButton({
  id,
  retired,
  action,
}: {
  id: string;
  retired: boolean;
  action: (raw: unknown) => Promise<ActionResult<{ id: string; retired: boolean }>>;
}) {
  const { pending, notice, run } = useActionButton();
  return (
    <div className="flex flex-wrap items-center gap-3">
      <Button
        type="button"
        variant={retired ? "secondary" : "danger"}
        pending={pending}
        onClick={() =>
          run(
            () => action({ id, retired: !retired }),
            (r) => (r.retired ? "Retired." : "Brought back into use."),
          )
        }
      >
        {retired ? "Bring back into use" : "Retire this procedure"}
      </Button>
      {notice ? <ActionNotice ok={notice.ok}>{notice.message}</ActionNotice> : null}
    </div>
  );
}
