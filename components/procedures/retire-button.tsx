"use client";

import { useState, useTransition } from "react";
import { useRouter } from "next/navigation";
import { ActionNotice, Button } from "@/components/ui/button";
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
  const router = useRouter();
  const [pending, start] = useTransition();
  const [notice, setNotice] = useState<{ ok: boolean; message: string } | null>(null);
  return (
    <div className="flex flex-wrap items-center gap-3">
      <Button
        type="button"
        variant={retired ? "secondary" : "danger"}
        pending={pending}
        onClick={() =>
          start(async () => {
            const res = await action({ id, retired: !retired });
            setNotice(
              res.ok
                ? { ok: true, message: res.data.retired ? "Retired." : "Brought back into use." }
                : { ok: false, message: res.message },
            );
            if (res.ok) router.refresh();
          })
        }
      >
        {retired ? "Bring back into use" : "Retire this procedure"}
      </Button>
      {notice ? <ActionNotice ok={notice.ok}>{notice.message}</ActionNotice> : null}
    </div>
  );
}
