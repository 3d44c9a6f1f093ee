import { Controller, Get } from '@nestjs/common';
import { ApiOperation, ApiTags } from '@nestjs/swagger';
import { ROLES } from '@crumbproof/shared';
import { Roles } from '../common/roles.decorator';
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
}
