// The music core's arrangement and intro analysis, imported in one place.
export { arrange, suggestIntros } from "@/lib/chart";
