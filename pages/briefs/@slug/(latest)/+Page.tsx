import { useData } from "vike-react/useData";
import { BriefPage } from "#components/brief/BriefPage";
import type { BriefPageData } from "#web/pages/page-data";

export default function Page() {
  return <BriefPage data={useData<BriefPageData>()} />;
}
