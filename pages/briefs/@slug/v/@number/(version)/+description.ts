export { default } from "../../../(latest)/+description";
