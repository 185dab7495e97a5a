import { Faker, base, en } from "@faker-js/faker";

// Every random choice in the demo scenario goes through a seeded faker instance, so the same seed
// always builds the same data. Each part of the scenario (people, hardware, submissions) gets its
// own instance: adding a person must not reshuffle every submission.

export type Rng = {
  faker: Faker;
  /** uniform in [0, 1) */
  uniform(): number;
  /** standard normal, N(0, 1) */
  normal(): number;
  /** integer in [min, max], both included */
  int(min: number, max: number): number;
  chance(probability: number): boolean;
  pick<T>(items: readonly T[]): T;
  weighted<T>(choices: ReadonlyArray<readonly [T, number]>): T;
};

export function createRng(seed: number): Rng {
  const faker = new Faker({ locale: [en, base] });
  faker.seed(seed);
  const uniform = () => faker.number.float({ min: 0, max: 1 }) % 1;
  return {
    faker,
    uniform,
    // Box–Muller transform: faker has no normal distribution of its own.
    normal() {
      const u1 = Math.max(uniform(), 1e-12);
      const u2 = uniform();
      return Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
    },
    int: (min, max) => faker.number.int({ min, max }),
    chance: (p) => uniform() < p,
    pick<T>(items: readonly T[]): T {
      return faker.helpers.arrayElement(items);
    },
    weighted<T>(choices: ReadonlyArray<readonly [T, number]>): T {
      return faker.helpers.weightedArrayElement(choices.map(([value, weight]) => ({ value, weight })));
    },
  };
}
