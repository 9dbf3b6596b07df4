export { default } from "../../+Head";
