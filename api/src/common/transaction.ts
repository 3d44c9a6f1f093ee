import { Injectable } from '@nestjs/common';
import { Sequelize } from 'sequelize-typescript';
import type { Transaction } from 'sequelize';
import { retryingConflicts } from './conflict-retry';

/**
 * The one place transactions are opened: all or nothing. A transaction that loses a deadlock or,
 * on a Galera cluster, a certification conflict to another is run again from the start, so `work`
 * reads the winner's write (a kitchen write's checks see the other node's recipe); its
 * afterCommit hooks run only for the attempt that commits.
 */
@Injectable()
export class TransactionRunner {
  constructor(private readonly sequelize: Sequelize) {}

  run<T>(work: (t: Transaction) => Promise<T>): Promise<T> {
    return retryingConflicts(() => this.sequelize.transaction((t) => work(t)));
  }
}
