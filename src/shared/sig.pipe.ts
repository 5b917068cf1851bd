import { Pipe, PipeTransform } from '@angular/core';
import { modelName, sig } from './format';

/** {{ value | sig }}: about four significant figures. */
@Pipe({ name: 'sig' })
export class SigPipe implements PipeTransform {
  transform(v: number | null | undefined, digits = 4): string {
    return sig(v, digits);
  }
}

/** {{ code | modelName }}: Schaefer, Pella-Tomlinson, … */
@Pipe({ name: 'modelName' })
export class ModelNamePipe implements PipeTransform {
  transform(code: string): string {
    return modelName(code);
  }
}
