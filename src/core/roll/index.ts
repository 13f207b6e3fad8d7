/** Roll versus term: strategies, views of future rates, money, break-evens, summaries and CSV. */
export * from './rollVsTerm.ts';
