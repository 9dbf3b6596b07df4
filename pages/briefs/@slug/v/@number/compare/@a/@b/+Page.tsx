import { useData } from "vike-react/useData";
import { ComparisonPage } from "#components/brief/ComparisonPage";
import type { ComparisonPageData } from "#web/pages/page-data";

export default function Page() {
  return <ComparisonPage data={useData<ComparisonPageData>()} />;
}
