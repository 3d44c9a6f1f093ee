import { Body, Controller, Get, HttpCode, Param, Post, Put, Query, Res } from '@nestjs/common';
import { ApiOperation, ApiProduces, ApiQuery, ApiTags } from '@nestjs/swagger';
import type { FastifyReply } from 'fastify';
import {
  counterAnswerSchema,
  counterDayQuerySchema,
  counterDaySchema,
  counterQuestionSchema,
  counterQuestionsQuerySchema,
  KITCHEN_WRITERS,
  ROLES,
  type CounterAnswerRequest,
  type CounterDay,
  type CounterDayQuery,
  type CounterQuestionRequest,
  type CounterQuestionsQuery,
} from '@crumbproof/shared';
import { CurrentUser, type AuthUser } from '../common/current-user.decorator';
import { Roles } from '../common/roles.decorator';
import { ApiZodBody, ZodPipe } from '../common/zod.pipe';
import { CounterQuestionsService } from './counter-questions.service';
import { CounterStream } from './counter-stream';
import { CounterService } from './counter.service';

/** The counter: every product's declaration for answering customers, its live updates, today's display and questions for the kitchen. */
@ApiTags('counter')
@Controller('counter')
export class CounterController {
  constructor(
    private readonly counter: CounterService,
    private readonly stream: CounterStream,
    private readonly questions: CounterQuestionsService,
  ) {}

  @Get('products')
  @Roles(ROLES)
  @ApiOperation({ summary: 'Every product for sale with its served declaration and whether it is on sale today, computed at one time' })
  products() {
    return this.counter.products();
  }

  @Get('events')
  @Roles(ROLES)
  @ApiProduces('text/event-stream')
  @ApiOperation({
    summary:
      'Server-sent events: declarations-changed (with the products touched), question-answered, display-changed; a heartbeat every 15 s',
  })
  events(@Res() reply: FastifyReply) {
    return this.stream.open(reply);
  }

  @Get('today')
  @Roles(ROLES)
  @ApiOperation({ summary: 'The products on sale on a day (today by default; a past day can be looked up)' })
  @ApiQuery({ name: 'date', required: false, format: 'date', description: 'The day, YYYY-MM-DD' })
  day(@Query(new ZodPipe(counterDayQuerySchema)) query: CounterDayQuery) {
    return this.counter.day(query.date);
  }

  @Put('today')
  @Roles(KITCHEN_WRITERS)
  @ApiOperation({ summary: 'Mark the products on sale on a day (manager, pastry chef)' })
  @ApiZodBody(counterDaySchema)
  setDay(@CurrentUser() user: AuthUser, @Body(new ZodPipe(counterDaySchema)) body: CounterDay) {
    return this.counter.setDay(body, user);
  }

  @Post('questions')
  @Roles(ROLES)
  @HttpCode(201)
  @ApiOperation({ summary: 'Ask the kitchen about a product for a customer who must avoid some allergens (who and when are recorded)' })
  @ApiZodBody(counterQuestionSchema)
  ask(@CurrentUser() user: AuthUser, @Body(new ZodPipe(counterQuestionSchema)) body: CounterQuestionRequest) {
    return this.questions.ask(body, user);
  }

  @Get('questions')
  @Roles(ROLES)
  @ApiOperation({ summary: 'Questions asked of the kitchen, newest first; open=true lists those not answered yet' })
  @ApiQuery({ name: 'open', required: false, enum: ['true', 'false'] })
  listQuestions(@Query(new ZodPipe(counterQuestionsQuerySchema)) query: CounterQuestionsQuery) {
    return this.questions.list(query.open === 'true');
  }

  @Post('questions/:id/answer')
  @Roles(KITCHEN_WRITERS)
  @HttpCode(200)
  @ApiOperation({ summary: 'Answer a question (manager, pastry chef); every open counter is told' })
  @ApiZodBody(counterAnswerSchema)
  answer(@CurrentUser() user: AuthUser, @Param('id') id: string, @Body(new ZodPipe(counterAnswerSchema)) body: CounterAnswerRequest) {
    return this.questions.answer(id, body, user);
  }
}
