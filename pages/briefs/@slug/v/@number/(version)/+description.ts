export { default } from "#pages/briefs/@slug/(latest)/+description";
