// Design tokens: Jigwright's own palette (paper, pine, copper), spacing and type scale.
export const colors = {
  paper: '#F6F3EC',
  surface: '#FFFFFF',
  sunk: '#ECE7DC',
  ink: '#1F2421',
  inkMuted: '#5A625D',
  line: '#D8D1C2',
  pine: '#2F6B4F',
  pineDark: '#1F4A36',
  pineSoft: '#DCEBE2',
  copper: '#B8652A',
  copperSoft: '#F5E3D3',
  danger: '#A83A2A',
  dangerSoft: '#F7DCD6',
  ok: '#2F6B4F',
  caution: '#8A6A00',
  cautionSoft: '#FBF0C9',
} as const;

export const space = { xs: 4, sm: 8, md: 12, lg: 16, xl: 24, xxl: 32 } as const;
export const radius = { sm: 4, md: 8, lg: 14 } as const;

export const fonts = {
  regular: 'IBMPlexSans_400Regular',
  medium: 'IBMPlexSans_500Medium',
  bold: 'IBMPlexSans_700Bold',
  mono: 'IBMPlexMono_400Regular',
} as const;

export const type = {
  title: { fontFamily: fonts.bold, fontSize: 24, lineHeight: 30 },
  heading: { fontFamily: fonts.bold, fontSize: 18, lineHeight: 24 },
  body: { fontFamily: fonts.regular, fontSize: 15, lineHeight: 22 },
  small: { fontFamily: fonts.regular, fontSize: 13, lineHeight: 18 },
  label: { fontFamily: fonts.medium, fontSize: 13, lineHeight: 18 },
  mono: { fontFamily: fonts.mono, fontSize: 13, lineHeight: 18 },
} as const;
