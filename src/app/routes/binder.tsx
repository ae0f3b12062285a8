import { useNavigate, useParams } from "react-router";
import { BinderDetail, BinderUnavailable } from "../../features/binders/components/binder-detail";
import { BinderPlans } from "../../features/plan/components/binder-plans";

function parseId(raw: string | undefined): number | null {
  if (!raw || !/^[1-9]\d{0,15}$/.test(raw)) return null;
  const id = Number(raw);
  return Number.isSafeInteger(id) ? id : null;
}

export default function BinderPage() {
  const id = parseId(useParams().id);
  const navigate = useNavigate();
  if (id === null) return <BinderUnavailable />;
  return (
    <>
      <BinderDetail key={id} binderId={id} onDeleted={() => void navigate("/binders", { replace: true })} />
      <BinderPlans key={`plans-${id}`} binderId={id} />
    </>
  );
}
