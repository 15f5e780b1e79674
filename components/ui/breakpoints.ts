import { useWindowDimensions } from 'react-native';

// Phone first: everything is laid out for a narrow screen, and widens at these widths.
export const breakpoints = { tablet: 720, desktop: 1100 } as const;

export function useBreakpoint() {
  const { width } = useWindowDimensions();
  return {
    width,
    isWide: width >= breakpoints.tablet,
    isDesktop: width >= breakpoints.desktop,
  };
}
