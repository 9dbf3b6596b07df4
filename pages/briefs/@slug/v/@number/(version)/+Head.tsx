export { default } from "#pages/briefs/@slug/(latest)/+Head";
