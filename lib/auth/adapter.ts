import SequelizeAdapter, { type SequelizeAdapterOptions } from "@next-auth/sequelize-adapter";
import type { Adapter, AdapterUser } from "next-auth/adapters";
import type { Sequelize } from "sequelize";
import { Account, AuthSession, db, User, VerificationToken } from "@/models";
import { byEmail } from "./accounts";

// next-auth's Sequelize adapter on our own tables and models (migrations own the schema, hence
// synchronize: false). Two methods are replaced because our users table differs from the
// adapter's defaults:
//  - getUserByEmail compares lower(email), as the unique index does, so an address stored with
//    capitals is still found and never duplicated;
//  - createUser gives a magic-link newcomer a name (users.name is required, 1–80 characters),
//    taken from the address until they change it on the profile page, and the contributor role.

const plain = (u: User | null): AdapterUser | null => (u ? (u.get({ plain: true }) as unknown as AdapterUser) : null);

export function nameFromEmail(email: string): string {
  const local =
    email
      .split("@")[0]
      ?.replace(/[._+-]+/g, " ")
      .trim() ?? "";
  return (local || "New member").slice(0, 80);
}

let built: { sequelize: Sequelize; adapter: Adapter } | undefined;

export function shuntbookAdapter(): Adapter {
  const sequelize = db();
  if (built?.sequelize === sequelize) return built.adapter;
  // the adapter adds its own belongsTo associations each time it is made, hence one per instance
  const base = SequelizeAdapter(sequelize, {
    synchronize: false,
    // our models carry more than the adapter's attribute types know (role, timestamps)
    models: { User, Account, Session: AuthSession, VerificationToken } as unknown as SequelizeAdapterOptions["models"],
  });
  const adapter: Adapter = {
    ...base,
    async getUserByEmail(email) {
      return plain(await User.findOne({ where: byEmail(email) }));
    },
    async createUser(data: Omit<AdapterUser, "id">) {
      const email = data.email.trim().toLowerCase();
      const user = await User.create({
        email,
        name: data.name?.trim().slice(0, 80) || nameFromEmail(email),
        emailVerified: data.emailVerified ?? null,
        image: data.image ?? null,
        role: "contributor",
      });
      return plain(user)!;
    },
  };
  built = { sequelize, adapter };
  return adapter;
}
