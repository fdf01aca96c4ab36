import { StampForm, type StampFormValues } from "@/components/stamps/stamp-form";
import { Panel } from "@/components/ui/panel";
import type { FormState } from "@/lib/actions/form-state";
import type { Actor } from "@/lib/authz";
import { listLocations } from "@/lib/data/stamps/locations";
import { locationLabel } from "@/lib/stamps/format";

/** A stamp record not yet made: every field empty, a sound single-faced stamp. */
export const blankStamp: StampFormValues = {
  code: "",
  name: "",
  widthMm: null,
  heightMm: null,
  stripDepthMm: null,
  weightG: null,
  face: "single",
  mirrored: false,
  twinCode: null,
  maker: null,
  madeOn: null,
  condition: "sound",
  locationId: null,
  coverageRatio: null,
  outlinePath: null,
  impressionsCount: 0,
  notes: null,
  tags: [],
};

/**
 * The form of a new stamp record in the person's units with the shelf's locations: the shelf's "New stamp" and a
 * keeper recording the stamp a new-stamp request asked for (prefilled from the request) share it.
 */
export async function NewStampPanel({
  actor,
  action,
  prefill = {},
  hidden,
  cancelTo,
}: {
  actor: Actor;
  action: (state: FormState, formData: FormData) => Promise<FormState>;
  prefill?: Partial<StampFormValues>;
  hidden?: Record<string, string>;
  cancelTo?: string;
}) {
  const locations = await listLocations(actor);
  return (
    <Panel>
      <StampForm
        action={action}
        mode="create"
        unitSystem={actor.unitSystem}
        locations={locations.map((l) => ({ id: l.id, label: locationLabel(l) }))}
        hidden={hidden}
        cancelTo={cancelTo}
        initial={{ ...blankStamp, ...prefill }}
      />
    </Panel>
  );
}
