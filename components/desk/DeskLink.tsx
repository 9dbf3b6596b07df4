// The desk's one kind of link between its screens. React Router moves between them; Vike's router,
// which follows every other link of the site, is told to leave these alone (data-vike="false"). Vike
// does not look at whether a click was already handled, so without it the desk page was rendered a
// second time a few hundred milliseconds after React Router had shown the screen: every screen was
// mounted again, every query fetched again, and what had been typed into a form in between was lost.
import { Link, type LinkProps } from "react-router";

export function DeskLink(props: LinkProps) {
  return <Link {...props} data-vike="false" />;
}
