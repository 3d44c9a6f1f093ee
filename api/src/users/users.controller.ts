import { Body, Controller, Delete, Get, HttpCode, Param, ParseIntPipe, Patch, Post } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import {
  createUserSchema,
  updateUserSchema,
  type CreateUserRequest,
  type TakenOffKitchen,
  type UpdateUserRequest,
  type UserAdded,
} from '@crumbproof/shared';
import { CurrentUser, type AuthUser } from '../common/current-user.decorator';
import { Roles } from '../common/roles.decorator';
import { ApiZodBody, ZodPipe } from '../common/zod.pipe';
import { UsersService } from './users.service';

@ApiTags('users')
@Controller('users')
@Roles(['manager'])
export class UsersController {
  constructor(private readonly users: UsersService) {}

  @Get()
  @ApiOperation({ summary: 'List the people of the request’s kitchen, each with their role there (manager)' })
  list() {
    return this.users.list();
  }

  @Post()
  @HttpCode(201)
  @ApiOperation({
    summary:
      'Add a person with a role at the request’s kitchen (manager): a new account with the password given, or an account of another kitchen given the role here, keeping its own password (outcome says which)',
  })
  @ApiZodBody(createUserSchema)
  create(@Body(new ZodPipe(createUserSchema)) body: CreateUserRequest): Promise<UserAdded> {
    return this.users.create(body);
  }

  @Patch(':id')
  @ApiOperation({
    summary:
      'Change a person of the request’s kitchen (manager): name, role here, password or active state (those two only for a manager at every kitchen they work in); a new password, role or deactivation ends their sessions',
  })
  @ApiZodBody(updateUserSchema)
  update(
    @CurrentUser() actor: AuthUser,
    @Param('id', ParseIntPipe) id: number,
    @Body(new ZodPipe(updateUserSchema)) body: UpdateUserRequest,
  ) {
    return this.users.update(actor, id, body);
  }

  @Delete(':id/kitchen')
  @HttpCode(200)
  @ApiOperation({
    summary:
      'Take a person off the request’s kitchen (manager): their role here goes and their sessions end; their account and other kitchens stay',
  })
  takeOff(@CurrentUser() actor: AuthUser, @Param('id', ParseIntPipe) id: number): Promise<TakenOffKitchen> {
    return this.users.takeOffKitchen(actor, id);
  }
}
