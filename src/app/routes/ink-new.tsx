import { useNavigate } from "react-router";
import { Card } from "../../components/ui/card";
import { Loading } from "../../components/ui/loading";
import { Notice } from "../../components/ui/notice";
import { PageHeader } from "../../components/ui/page-header";
import { toast } from "../../components/ui/toast";
import { Button } from "../../components/ui/button";
import { RequireRole } from "../../features/accounts/components/require-role";
import { useCreateInk } from "../../features/inks/api/create-ink";
import { useBrands } from "../../features/inks/api/get-brands";
import { InkForm } from "../../features/inks/components/ink-form";
import { errorMessage } from "../../lib/api-client";

function NewInkForm() {
  const brands = useBrands();
  const createInk = useCreateInk();
  const navigate = useNavigate();

  if (brands.isPending) return <Loading label="Loading brands…" />;
  if (brands.isError) {
    return (
      <Notice tone="error" title="Brands could not be loaded" live>
        <p>{errorMessage(brands.error)}</p>
        <Button variant="secondary" className="mt-3" onClick={() => void brands.refetch()}>
          Try again
        </Button>
      </Notice>
    );
  }
  return (
    <InkForm
      brands={brands.data}
      submitLabel="Add ink"
      busyLabel="Adding…"
      onCancel={() => void navigate("/inks")}
      onSubmit={async (values) => {
        const ink = await createInk.mutateAsync(values);
        toast.success(`${ink.name} is in the catalogue.`);
        await navigate(`/inks/${ink.id}`);
      }}
    />
  );
}

export default function NewInkPage() {
  return (
    <>
      <PageHeader
        documentTitle="New ink"
        eyebrow="Ink catalogue"
        title="Add an ink"
        intro="One ink as its maker sells it. Give its reference colour from a dried swatch on white cardstock."
      />
      <RequireRole role="moderator">
        {() => (
          <Card className="max-w-2xl">
            <NewInkForm />
          </Card>
        )}
      </RequireRole>
    </>
  );
}
