import { useQueryClient } from "@tanstack/react-query";
import { ButtonLink } from "../../components/ui/button";
import { PageHeader } from "../../components/ui/page-header";
import { RequireRole } from "../../features/accounts/components/require-role";
import { InkPicker } from "../../features/inks/components/ink-picker";
import type { InkSearchSlot } from "../../features/review/components/ink-tags-editor";
import { ModeratorsOnly } from "../../features/review/components/moderators-only";
import { ReviewQueue } from "../../features/review/components/review-queue";
import { stripKeys } from "../../features/strips/api/keys";
import { canModerate } from "../../lib/roles";

const inkSearch: InkSearchSlot = ({ onPick, chosenIds, disabled }) => (
  <InkPicker
    label="Add an ink from the catalogue"
    hint="Type part of an ink's name or its brand. It is added at the end; move it into place."
    chosenIds={chosenIds}
    disabled={disabled}
    onPick={(ink) => onPick({ id: ink.id, name: ink.name, brand: ink.brand.name, hex: ink.hex })}
  />
);

export default function ReviewPage() {
  const queryClient = useQueryClient();
  return (
    <RequireRole>
      {(me) =>
        canModerate(me.role) ? (
          <>
            <PageHeader
              documentTitle="Review queue"
              eyebrow="Moderation"
              title="Review queue"
              intro="Strips waiting for a decision, oldest first. Every decision needs a reason; the author is told."
              actions={
                <ButtonLink variant="secondary" to="/moderation/log">
                  Moderation log
                </ButtonLink>
              }
            />
            <ReviewQueue
              inkSearch={inkSearch}
              onStripChanged={(id) => {
                void queryClient.invalidateQueries({ queryKey: stripKeys.detail(id) });
                void queryClient.invalidateQueries({ queryKey: stripKeys.lists() });
              }}
            />
          </>
        ) : (
          <ModeratorsOnly what="The review queue" />
        )
      }
    </RequireRole>
  );
}
