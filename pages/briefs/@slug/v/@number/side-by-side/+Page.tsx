import { useData } from "vike-react/useData";
import { SideBySidePage } from "#components/brief/SideBySidePage";
import type { SideBySidePageData } from "#web/pages/page-data";

export default function Page() {
  return <SideBySidePage data={useData<SideBySidePageData>()} />;
}
