import { Body, Controller, Get, HttpCode, Param, ParseIntPipe, Patch, Post } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import { createUserSchema, updateUserSchema, type CreateUserRequest, type UpdateUserRequest } from '@crumbproof/shared';
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
  @ApiOperation({ summary: 'List the kitchen’s users (manager)' })
  list() {
    return this.users.list();
  }

  @Post()
  @HttpCode(201)
  @ApiOperation({ summary: 'Create a user with a role (manager)' })
  @ApiZodBody(createUserSchema)
  create(@Body(new ZodPipe(createUserSchema)) body: CreateUserRequest) {
    return this.users.create(body);
  }

  @Patch(':id')
  @ApiOperation({
    summary: 'Change a user’s name, role, password or active state (manager); a new password, role or deactivation ends their sessions',
  })
  @ApiZodBody(updateUserSchema)
  update(
    @CurrentUser() actor: AuthUser,
    @Param('id', ParseIntPipe) id: number,
    @Body(new ZodPipe(updateUserSchema)) body: UpdateUserRequest,
  ) {
    return this.users.update(actor, id, body);
  }
}
