import { Body, Controller, Get, Patch } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import { kitchenUpdateSchema, ROLES, type KitchenUpdate } from '@crumbproof/shared';
import { Roles } from '../common/roles.decorator';
import { ApiZodBody, ZodPipe } from '../common/zod.pipe';
import { KitchenService } from './kitchen.service';

@ApiTags('kitchen')
@Controller('kitchen')
export class KitchenController {
  constructor(private readonly kitchen: KitchenService) {}

  @Get()
  @Roles(ROLES)
  @ApiOperation({ summary: 'The kitchen: name, address, declaring regime and allergen handling' })
  get() {
    return this.kitchen.view();
  }

  @Patch()
  @Roles(['manager'])
  @ApiOperation({ summary: 'Change the kitchen’s regime, measures or allergen handling (manager)' })
  @ApiZodBody(kitchenUpdateSchema)
  update(@Body(new ZodPipe(kitchenUpdateSchema)) body: KitchenUpdate) {
    return this.kitchen.update(body);
  }
}
