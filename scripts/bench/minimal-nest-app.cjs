// The reference for the server's memory: a minimal NestJS app (one module, one GET route, Express).
//   PORT=… node scripts/bench/minimal-nest-app.cjs
require('reflect-metadata');
const { Controller, Get, Module } = require('@nestjs/common');
const { NestFactory } = require('@nestjs/core');

class HealthController {
  health() {
    return { status: 'ok' };
  }
}
Get()(HealthController.prototype, 'health', Object.getOwnPropertyDescriptor(HealthController.prototype, 'health'));
Controller('api/health')(HealthController);

class AppModule {}
Module({ controllers: [HealthController] })(AppModule);

NestFactory.create(AppModule, { logger: false })
  .then((app) => app.listen(Number(process.env.PORT), '127.0.0.1'))
  .catch((error) => {
    console.error(error);
    process.exit(1);
  });
