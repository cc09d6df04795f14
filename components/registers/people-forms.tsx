"use client";

import { inviteUserAction, updateUserAction } from "@/app/(app)/registers/actions";
import { ROLE_LABELS, ROLES, type Role } from "@/lib/domain/roles";
import { Field, inputClass } from "@/components/ui/field";
import { Form } from "@/components/ui/form";
import { userInviteSchema, userUpdateSchema } from "@/lib/validations/registers";

export function InviteForm({ customers }: { customers: ReadonlyArray<{ id: string; name: string }> }) {
  return (
    <Form
      action={inviteUserAction}
      schema={userInviteSchema}
      submitLabel="Send invitation"
      successMessage="Invitation queued; the e-mail carries a one-time link to set a password."
    >
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        <Field name="name" label="Name">
          <input name="name" className={inputClass} />
        </Field>
        <Field name="email" label="E-mail">
          <input name="email" type="email" className={inputClass} />
        </Field>
        <Field name="role" label="Role">
          <select name="role" className={inputClass} defaultValue="installer">
            {ROLES.map((r) => (
              <option key={r} value={r}>
                {ROLE_LABELS[r]}
              </option>
            ))}
          </select>
        </Field>
        <Field name="customerId" label="Company (customer users only)">
          <select name="customerId" className={inputClass} defaultValue="">
            <option value="">Service company (staff)</option>
            {customers.map((c) => (
              <option key={c.id} value={c.id}>
                {c.name}
              </option>
            ))}
          </select>
        </Field>
      </div>
    </Form>
  );
}

export function PersonControls({
  userId,
  role,
  disabled,
  isCustomer,
}: {
  userId: string;
  role: Role;
  disabled: boolean;
  isCustomer: boolean;
}) {
  return (
    <div className="flex flex-nowrap items-start gap-2">
      {!isCustomer ? (
        <Form
          action={updateUserAction}
          schema={userUpdateSchema}
          submitLabel="Change role"
          variant="secondary"
          resetOnSuccess={false}
          successMessage="Role changed; open sessions end."
          className="flex flex-wrap items-center gap-2 space-y-0"
        >
          <input type="hidden" name="userId" value={userId} />
          <label className="sr-only" htmlFor={`role-${userId}`}>
            Role
          </label>
          <select
            id={`role-${userId}`}
            name="role"
            defaultValue={role}
            className="min-h-touch rounded-md border border-graphite-300 bg-white px-2 text-sm"
          >
            {ROLES.filter((r) => r !== "customer").map((r) => (
              <option key={r} value={r}>
                {ROLE_LABELS[r]}
              </option>
            ))}
          </select>
        </Form>
      ) : null}
      <Form
        action={updateUserAction}
        schema={userUpdateSchema}
        submitLabel={disabled ? "Enable" : "Disable"}
        variant="secondary"
        resetOnSuccess={false}
        successMessage={disabled ? "Enabled." : "Disabled; open sessions end now."}
        className="space-y-0"
      >
        <input type="hidden" name="userId" value={userId} />
        <input type="hidden" name="disabled" value={disabled ? "false" : "true"} />
      </Form>
    </div>
  );
}
