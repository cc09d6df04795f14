"use client";

import { inviteUserAction, updateUserAction } from "@/app/(app)/registers/actions";
import { ROLE_LABELS, ROLES, type Role } from "@/lib/domain/roles";
import { FieldsForm, HiddenFields } from "@/components/ui/form-fields";
import { Form } from "@/components/ui/form";
import { closedSetOptions, OptionList } from "@/components/ui/field";
import { userInviteSchema, userUpdateSchema } from "@/lib/validations/registers";

const ROLE_OPTIONS = closedSetOptions(ROLES, ROLE_LABELS);
const STAFF_ROLE_OPTIONS = ROLE_OPTIONS.filter((o) => o.value !== "customer");

export function InviteForm({ customers }: { customers: ReadonlyArray<{ id: string; name: string }> }) {
  return (
    <FieldsForm
      action={inviteUserAction}
      schema={userInviteSchema}
      submitLabel="Send invitation"
      successMessage="Invitation queued; the e-mail carries a one-time link to set a password."
      fields={[
        { name: "name", label: "Name" },
        { name: "email", label: "E-mail", type: "email" },
        { name: "role", label: "Role", options: ROLE_OPTIONS, defaultValue: "installer" },
        {
          name: "customerId",
          label: "Company (customer users only)",
          placeholder: "Service company (staff)",
          options: customers.map((c) => ({ value: c.id, label: c.name })),
        },
      ]}
    />
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
            <OptionList options={STAFF_ROLE_OPTIONS} />
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
        <HiddenFields values={{ userId, disabled: disabled ? "false" : "true" }} />
      </Form>
    </div>
  );
}
