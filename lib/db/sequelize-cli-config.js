// sequelize-cli reads this file; npm start and npm test run the same migrations through umzug.
const common = { use_env_variable: "DATABASE_URL", dialect: "postgres", seederStorage: "sequelize", logging: false };
module.exports = { development: common, test: common, production: common };
