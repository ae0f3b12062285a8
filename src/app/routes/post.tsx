import { useState } from "react";
import { useSearchParams } from "react-router";
import type { Me } from "../../../shared/schemas/accounts";
import { Button, ButtonLink } from "../../components/ui/button";
import { Card } from "../../components/ui/card";
import { Loading } from "../../components/ui/loading";
import { Notice } from "../../components/ui/notice";
import { PageHeader } from "../../components/ui/page-header";
import { useMe } from "../../features/accounts/api/get-me";
import { useInksById } from "../../features/inks/api/get-inks-by-id";
import { InkPicker } from "../../features/inks/components/ink-picker";
import { useStash } from "../../features/stash/api/get-stash";
import { ChooseStage } from "../../features/strips/components/post-choose-stage";
import { UploadStage, type PostInkTools } from "../../features/strips/components/post-upload-stage";
import type { InkColourLookup, InkPickerSlot } from "../../features/strips/ink-choice";
import { errorMessage } from "../../lib/api-client";

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

function VisitorPrompt() {
  return (
    <>
      <PageHeader documentTitle="Post a strip" title="Post a strip" intro="Share a dried blended strip with its inks, in order." />
      <Card className="max-w-xl space-y-4">
        <h2 className="text-xl font-bold">Sign in to post a strip</h2>
        <p className="text-ink-soft">
          Posting needs a Blendwell account, so others can see who made each strip. Signing in with a link by e-mail
          creates your account the first time.
        </p>
        <div className="flex flex-wrap gap-3">
          <ButtonLink to={`/sign-in?next=${encodeURIComponent("/post")}`}>Sign in to post</ButtonLink>
          <ButtonLink to="/help" variant="secondary">
            How to photograph a strip
          </ButtonLink>
        </div>
      </Card>
    </>
  );
}

/** The catalogue's reference colours of these inks, as they load. */
function useInkColours(ids: number[]): InkColourLookup {
  const catalogue = useInksById(ids);
  return (id) => {
    const ink = catalogue.get(id);
    return ink ? { hex: ink.hex, lab: ink.lab } : undefined;
  };
}

/** The catalogue's ink search, with the member's own inks first. */
function useInkTools(): PostInkTools {
  const stash = useStash();
  const stashIds = new Set(stash.data?.map((i) => i.ink.id));
  const picker: InkPickerSlot = ({ onPick, chosenIds, disabled }) => (
    <InkPicker
      chosenIds={chosenIds}
      disabled={disabled}
      hint="Type part of an ink's name. It is added at the end; move it into place."
      stashInkIds={stashIds}
      onPick={(ink) => onPick({ id: ink.id, name: ink.name, brand: ink.brand.name, hex: ink.hex, lab: ink.lab })}
    />
  );
  return { picker, useInkColours };
}

function SuspendedNotice({ me }: { me: Me }) {
  const [now] = useState(() => Date.now());
  if (!me.suspendedUntil || Date.parse(me.suspendedUntil) <= now) return null;
  return (
    <Notice tone="warning" title="Your account is suspended for now" className="mb-6">
      <p>Until {new Date(me.suspendedUntil).toLocaleDateString("en-GB")} you can browse, but strips you post will be refused.</p>
    </Notice>
  );
}

export default function PostPage() {
  const me = useMe();
  const [params, setParams] = useSearchParams();
  const raw = params.get("upload");
  const uploadId = raw && UUID.test(raw) ? raw.toLowerCase() : null;
  const inkTools = useInkTools();

  if (me.isPending) return <Loading label="Checking who is signed in…" />;
  if (me.isError) {
    return (
      <Notice tone="error" title="We could not check who is signed in" live>
        <p>{errorMessage(me.error)}</p>
        <Button variant="secondary" className="mt-3" onClick={() => void me.refetch()}>
          Try again
        </Button>
      </Notice>
    );
  }
  if (!me.data) return <VisitorPrompt />;

  return (
    <>
      <PageHeader
        documentTitle="Post a strip"
        title="Post a strip"
        intro={
          uploadId
            ? "Check the bands, confirm the inks in order, and add a few details."
            : "Photograph your dried strip on its white card, or choose a photo you already have."
        }
      />
      <SuspendedNotice me={me.data} />
      {uploadId ? (
        <UploadStage key={uploadId} uploadId={uploadId} me={me.data} onStartOver={() => setParams({})} inkTools={inkTools} />
      ) : (
        <ChooseStage onUploaded={(id) => setParams({ upload: id })} />
      )}
    </>
  );
}
