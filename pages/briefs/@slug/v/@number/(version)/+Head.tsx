export { default } from "../../../(latest)/+Head";
