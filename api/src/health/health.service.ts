import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import type { HealthResponse } from '@beamwright/link-core/contracts';

/** How long the probe may take before the database counts as down. */
const PROBE_TIMEOUT_MS = 1500;

@Injectable()
export class HealthService {
  constructor(@InjectDataSource() private readonly dataSource: DataSource) {}

  async check(): Promise<HealthResponse> {
    const up = await this.probeDatabase();
    return { status: up ? 'ok' : 'degraded', database: up ? 'up' : 'down' };
  }

  private async probeDatabase(): Promise<boolean> {
    let timer: NodeJS.Timeout | undefined;
    const timeout = new Promise<false>((resolve) => {
      timer = setTimeout(() => resolve(false), PROBE_TIMEOUT_MS);
    });
    // The pool drops broken connections and opens new ones on demand, so a probe after the
    // database comes back succeeds without restarting the API.
    const probe = this.dataSource.query('SELECT 1').then(
      () => true,
      () => false,
    );
    try {
      return await Promise.race([probe, timeout]);
    } finally {
      clearTimeout(timer);
    }
  }
}
