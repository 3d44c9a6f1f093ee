import { Box } from '@chakra-ui/react';

interface BrandMarkProps {
  size?: string;
}

/** Crumbproof's mark: the layer path, product on top, leaf ingredient below. Decorative. */
export function BrandMark({ size = '32px' }: BrandMarkProps) {
  return (
    <Box
      as="span"
      display="inline-flex"
      flexShrink={0}
      aria-hidden="true"
      css={{
        '& .ground': { fill: 'accent.solid' },
        '& .layer': { fill: 'accent.contrast' },
        '& .leaf': { fill: 'none', stroke: 'accent.contrast' },
      }}
    >
      <svg width={size} height={size} viewBox="0 0 32 32" focusable="false">
        <rect className="ground" width="32" height="32" rx="7" />
        <rect className="layer" x="7" y="7" width="18" height="5" rx="2.5" />
        <rect className="layer" x="10" y="14" width="15" height="4.5" rx="2.25" fillOpacity="0.85" />
        <rect className="leaf" x="13" y="20.5" width="12" height="4.5" rx="2.25" strokeWidth="1.6" strokeDasharray="2.4 1.6" />
      </svg>
    </Box>
  );
}
