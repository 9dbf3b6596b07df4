import { DeskApp } from "#components/desk/DeskApp";

export default function Page() {
  return <DeskApp />;
}
