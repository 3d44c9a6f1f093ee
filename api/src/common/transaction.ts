import { Injectable } from '@nestjs/common';
import { Sequelize } from 'sequelize-typescript';
import type { Transaction } from 'sequelize';

/** The one place transactions are opened: all or nothing. */
@Injectable()
export class TransactionRunner {
  constructor(private readonly sequelize: Sequelize) {}

  run<T>(work: (t: Transaction) => Promise<T>): Promise<T> {
    return this.sequelize.transaction((t) => work(t));
  }
}
