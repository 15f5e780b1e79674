import type { ParamDecl, ParamValues } from '../params';
import type { ReportValue, Warning } from '../generators/types';

export interface CalculatorResult {
  values: ReportValue[];
  warnings: Warning[];
}

export interface CalculatorDef {
  id: string;
  title: string;
  description: string;
  params: ParamDecl[];
  check?(p: ParamValues): { field: string; message: string }[];
  compute(p: ParamValues): CalculatorResult;
}
