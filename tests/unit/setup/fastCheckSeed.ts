// Property tests draw their random cases from one fixed seed, so a CI run is reproducible and a
// failure can be replayed. Explore new cases locally with ISLET_FC_SEED=random (or a number).
import fc from "fast-check";

const requested = process.env.ISLET_FC_SEED;
if (requested !== "random") {
  const seed = requested ? Number(requested) : 20261202;
  fc.configureGlobal({ ...fc.readConfigureGlobal(), seed });
}
