/**
 * The Spanish catalogue (Spain's usage, `es-ES`): every sentence a customer reads on a card,
 * an insert, a set page, the binder and the PDFs. Typed `Messages` (catalogue.ts), so a key
 * English has and this file lacks fails tsc. Written by the project, not reviewed by a
 * translator (content/README.md). Trade terms as Spanish coffee trade uses them: cafetera
 * (italiana), depósito (the base; the "caldera"), filtro/embudo (the basket and its tube),
 * colector (the upper chamber), junta, placa filtrante, válvula de seguridad, molienda,
 * tueste, hervidor, placa (a hob), fuego.
 */
import type { HeatKind } from '../content/heat-kind.ts';
import type { StovePower } from '../content/own-entries.ts';
import type { GrindClass, StoveKind, UnitSystem } from '../content/types.ts';
import type { BindingCauseCode, CheckedQuantity, RefusalCode } from '../planning/types.ts';
import type { Messages } from './catalogue.ts';
import type { BindingCauseText, HeatFeel } from './card.ts';
import type { RefusalText } from './plan.ts';
import type { ExerciseCardFacts, ExerciseMoveFacts, ExerciseText } from './binder.ts';

/** Grind classes as a noun phrase after "molienda" ("molienda media-fina"). */
const grindNames: Record<GrindClass, string> = {
  fine: 'fina',
  'medium-fine': 'media-fina',
  medium: 'media',
  'medium-coarse': 'media-gruesa',
  coarse: 'gruesa',
};

/** Roast degrees (the coffee schema's `roast` enum) after "tueste". */
const roastNames: Record<string, string> = {
  light: 'claro',
  'medium-light': 'medio-claro',
  medium: 'medio',
  'medium-dark': 'medio-oscuro',
  dark: 'oscuro',
};

const coarser: Record<GrindClass, GrindClass> = {
  fine: 'medium-fine',
  'medium-fine': 'medium',
  medium: 'medium-coarse',
  'medium-coarse': 'coarse',
  coarse: 'coarse',
};

const heatKindNames: Record<HeatKind, string> = {
  gas: 'Gas',
  electric: 'Eléctrica',
  induction: 'Inducción',
};

const quantityNames: Record<CheckedQuantity, string> = {
  permeabilityM2: 'La permeabilidad de la cama de café',
  heatToPotW: 'El calor que llega a la cafetera',
  altitudeM: 'La altitud',
  sealedVolumeM3: 'El volumen cerrado del depósito',
  ambientK: 'La temperatura ambiente',
};

const card: Messages['card'] = {
  siteTitle: 'Fichas de preparación para cafetera',
  stationSubtitle: (potName: string, stoveName: string): string =>
    `en ${potName} · sobre ${stoveName}`,
  insertSubtitle: (roast: string, grind: GrindClass): string =>
    `tueste ${roastNames[roast] ?? roast} · molienda ${grindNames[grind]}`,

  water: {
    heading: 'Agua',
    heated: 'Calentar el agua a',
    kettlePreset: (preset: string): string => `Use la posición de ${preset} del hervidor.`,
    thermometer: (temperature: string): string =>
      `Caliéntela a ${temperature}; compruébelo con un termómetro.`,
    roomTemperature: 'Agua a temperatura ambiente',
    roomTemperatureNote: (room: string): string =>
      `Agua que ha reposado en la sala (unos ${room}); no hace falta hervidor.`,
    heatedNote: 'Viértala caliente, cierre la cafetera y póngala enseguida al fuego.',
    fill: 'Llenar el depósito con',
    fillMass: (mass: string): string => `(${mass} en la báscula)`,
    fillLine: (height: string, below: string): string =>
      `Hasta ${height} desde el fondo: ${below} por debajo de la válvula.`,
  },
  coffee: {
    heading: 'Café',
    dose: 'Café molido',
    level: 'Filtro lleno hasta el borde, enrasado.',
    grind: (grind: GrindClass): string => `Molienda ${grindNames[grind]}.`,
    noTamp: 'No lo prense.',
  },
  heat: {
    heading: 'Fuego',
    setting: 'Posición',
    on: (stoveName: string): string => `en ${stoveName}`,
    fitted: 'Calor medido en este fuego con preparaciones cronometradas.',
  },
  timings: {
    heading: 'Tiempos',
    clockNote: 'Desde que la cafetera se pone al fuego.',
    firstCoffee: 'Primer café',
    offHeat: 'Retirar del fuego',
    watchHeading: 'Mire y escuche',
    watch: [
      'Al principio el café sube en un chorro oscuro y regular.',
      'Hacia el final se aclara y sale más deprisa.',
      'Un gorgoteo o un silbido indica que el depósito está casi vacío: el borboteo está cerca.',
      'Retire entonces la cafetera del fuego, o al tiempo indicado si llega antes, y enfríe el depósito bajo el grifo de agua fría para cortar la extracción.',
    ],
  },
  chart: {
    heading: 'Temperatura de cada sorbo',
    xTitle: (unit: string): string => `Café en la taza (${unit})`,
    yTitle: (unit: string): string => `Temperatura de extracción (${unit})`,
    thisCard: 'Esta ficha',
    coldStart: 'En frío',
    band: (band: string): string => `Objetivo ${band}`,
    caption:
      'Temperatura de extracción: la del agua al llegar al café molido (el punto de contacto de la SCA).',
    alt: (plan: string, cold: string, band: string): string =>
      `Gráfico: temperatura de extracción frente al café en la taza. Esta ficha: ${plan} de la taza en el objetivo ${band}; empezando en frío: ${cold}.`,
  },
  expect: {
    heading: 'Qué esperar',
    yield: 'Café en la taza',
    inBand: (band: string): string => `Extraído a ${band}`,
    inBandValue: (plan: string, cold: string): string => `${plan} de la taza (en frío: ${cold})`,
    peakPressure: 'Presión máxima en el depósito',
    peakPressureValue: (peak: string, valve: string, highest?: string): string =>
      `${peak}${highest ? ` (hasta ${highest})` : ''}; la válvula abre a ${valve}`,
    peakPressureAssumedValue: (peak: string, valve: string, highest?: string): string =>
      `${peak}${highest ? ` (hasta ${highest})` : ''}; la válvula abre a unos ${valve} (supuesto: no se indicó; consulte al fabricante)`,
    bindingCause: (code: BindingCauseCode, f: BindingCauseText): string => {
      const lead = `Solo el ${f.share} de la taza se extrae a ${f.band}`;
      switch (code) {
        case 'bed-too-open':
          return `${lead}: la cama de café es demasiado abierta para esta cafetera y el agua la atraviesa antes de estar caliente (${f.shareAtHalfPermeability ?? '?'} con una cama la mitad de permeable). Muela más fino o use una cafetera más grande.`;
        case 'bed-too-tight':
          return `${lead}: la cama de café es tan compacta que el agua pasa por encima del objetivo (unos ${f.mean} de media). Muela más grueso y no prense nunca.`;
        case 'gentlest-heat-too-strong':
          return `${lead}: incluso la posición más suave del fuego (${f.gentlest}) es demasiado fuerte para esta cafetera (${f.shareAtHalfHeat ?? '?'} con la mitad de calor). Use un difusor de calor o un quemador más pequeño.`;
        case 'pot-too-small-for-window':
          return `${lead}: la cafetera es demasiado pequeña para el tiempo de extracción de este café; su preparación de ${f.cups} tazas dura ${f.delivery} frente a ${f.window}. Use una cafetera más grande o una molienda más gruesa.`;
        case 'pressure-margin-binds':
          return `${lead}: empezar más caliente llegaría a ${f.highCorner} si los datos no son exactos, por encima del límite de media válvula de ${f.limit} (daría ${f.shareIfAllowed ?? '?'}). Cronometre unas preparaciones para afinar los datos, o muela más grueso.`;
        case 'band-out-of-reach':
          return `${lead} (unos ${f.mean} de media): ninguna posición de este fuego alcanza el objetivo con esta cafetera y este café. Pruebe otra molienda u otro fuego.`;
      }
    },
    boiling: 'Aquí el agua hierve a',
    boilingValue: (boiling: string, altitude: string): string => `${boiling} (altitud ${altitude})`,
    assumed: (grind: GrindClass | null, stove: boolean, tightening = false): string => {
      const parts = [
        ...(grind ? [`una molienda ${grindNames[grind]} típica`] : []),
        ...(stove ? ['un rendimiento típico para este tipo de fuego'] : []),
        ...(tightening ? ['que la cama se compacta como indica su ficha (aún sin pesar)'] : []),
      ];
      return `Los tiempos suponen ${parts.join(' y ')}; un registro de preparaciones cronometradas los afina.`;
    },
    measured: (
      items: readonly {
        readonly what: 'grind' | 'heat' | 'tightening';
        readonly percent: string;
        readonly log: string;
        readonly date: string;
      }[],
    ): string =>
      `Medido con preparaciones cronometradas: ${items
        .map(
          (m) =>
            `${m.what === 'grind' ? 'lo deprisa que pasa este café' : m.what === 'tightening' ? 'cuánto se compacta la cama durante la preparación' : 'el calor de esta posición'} (± ${m.percent} %, ${m.log}, ${m.date})`,
        )
        .join('; ')}.`,
  },
  warningsHeading: 'Compruebe',
  refusal: {
    heading: 'Sin receta en esta ficha',
    short: {
      'fill-above-valve': 'poco espacio bajo la válvula',
      'pressure-near-valve': 'café demasiado compacto para esta cafetera',
      'induction-needs-magnetic-base': 'el depósito no sirve para inducción',
      'no-delivery': 'el agua no llega a subir',
      'no-plan-fits': 'tiempo de extracción fuera de rango',
    } satisfies Record<RefusalCode, string>,
    why: 'Por qué',
    change: 'Qué cambiar',
    note: 'Esta cafetera, este café y este fuego no tienen receta porque no sería seguro o no saldría bien.',
  },
  cautions: {
    heading: 'Seguridad',
    full: [
      'Agua hirviendo, vapor y metal caliente: sujétela solo por el asa; use un paño para el depósito.',
      'Antes de cerrar, compruebe que la junta y la placa filtrante están enteras y en su sitio; limpie el borde del filtro.',
      'No llene nunca por encima de la válvula.',
      'No prense nunca el café.',
      'No caliente nunca la cafetera vacía.',
      'La llama no debe sobresalir del depósito; el asa, lejos de ella.',
      'No deje nunca la cafetera sola en el fuego; mantenga alejados a los niños.',
      'Cuando borbotee, aparte la cara y las manos del caño y de la tapa.',
      'No tape nunca la válvula de seguridad ni la dirija hacia nadie; manténgala limpia y libre. No use una cafetera con la válvula o la junta dañadas.',
      'Antes de abrirla, deje enfriar el depósito, o enfríelo bajo el grifo de agua fría sujetándola solo por el asa.',
    ],
    compact: [
      'Agua, vapor y metal calientes: solo por el asa.',
      'Revise junta y placa filtrante; limpie el borde.',
      'Nunca por encima de la válvula.',
      'No prense nunca.',
      'Nunca la caliente vacía.',
      'Llama no más ancha que el depósito; asa apartada.',
      'Nunca sola en el fuego; niños lejos.',
      'Cara y manos lejos del caño y la tapa.',
      'Nunca tape ni apunte la válvula; nunca con válvula o junta dañadas.',
      'Enfríe el depósito (grifo, por el asa) antes de abrir.',
    ],
    deferral: 'Siga las instrucciones del fabricante y la normativa local.',
  },
  footer: {
    printedBy: (business: string, contact: string): string => `De ${business} · ${contact}`,
    built: (date: string, fingerprint: string): string =>
      `calculada el ${date} · ficha ${fingerprint}`,
    qr: 'En la web:',
    qrLabel: 'Código QR',
    qrPlanner: 'Su cafetera y su fuego:',
    logoAlt: (business: string): string => `Logotipo de ${business}`,
  },
  planner: {
    link: (coffee: string): string => `Calcule ${coffee} para su propia cafetera y su fuego`,
  },
  crossSection: {
    title: (potName: string): string => `Corte de ${potName}`,
    fillLine: 'Nivel de llenado',
    valve: 'Válvula',
    margin: (gap: string): string => `${gap} bajo la válvula`,
    basket: 'Filtro',
    tube: 'Tubo del embudo',
  },
  insert: {
    heading: 'Cómo prepararlo en cafetera italiana',
    intro: 'Busque en la tabla el tamaño de su cafetera y su tipo de fuego, y siga los pasos.',
    columns: {
      pot: 'Cafetera',
      heat: 'Fuego',
      fill: 'Agua',
      dose: 'Café',
      start: 'Temp. agua',
      level: 'Posición',
      firstCoffee: 'Primer café',
      offHeat: 'Retirar',
    },
    heatKind: (kind: HeatKind): string => heatKindNames[kind],
    roomTemperature: 'temp. ambiente',
    notSuitable: 'No adecuada',
    web: (url: string): string =>
      `Fichas completas con el dibujo de llenado y un gráfico por fila: ${url}`,
    cups: (cups: number): string => `${cups} tazas`,
    rowName: (cups: string, heat: string): string => `${cups} ${heat.toLowerCase()}`,
    rowWarning: (rows: readonly string[], warning: string): string =>
      `${rows.join(', ')}: ${warning}`,
    fullCard: 'ficha completa',
    heatFeel: {
      gentle: 'fuego suave',
      medium: 'fuego medio',
      strong: 'fuego fuerte',
      full: 'fuego máximo',
    } satisfies Record<HeatFeel, string>,
    setting: (label: string, feel: string): string => `${label} · ${feel}`,
    steps: {
      heading: 'Paso a paso',
      kettle: (temperature: string | null, column: string): string =>
        temperature === null
          ? `Caliente agua en un hervidor a la temperatura de la columna «${column}» («temp. ambiente»: sin hervidor).`
          : `Caliente agua en un hervidor a ${temperature}.`,
      roomWater: 'Use agua que haya reposado en la sala: no hace falta hervidor.',
      fill: (volume: string | null, column: string): string =>
        `Viértala en el depósito hasta la marca, justo bajo la válvula${volume === null ? ` (columna «${column}»)` : `: ${volume}`}. Nunca por encima de la válvula.`,
      basket: (dose: string | null, column: string): string =>
        `Llene el filtro de café molido (${dose === null ? `según la columna «${column}»` : dose}), enrasado con el borde. No lo prense.`,
      seal: 'Enrosque bien la parte superior, sujetando el depósito caliente con un paño.',
      heat: (setting: string | null, column: string): string =>
        `Póngala al fuego en ${setting === null ? `la posición de la columna «${column}»` : `la posición ${setting}`}, con una llama que no sobresalga del depósito (en placa: una zona no mayor que el depósito).`,
      time: (offHeat: string | null, column: string): string =>
        `Cuente desde que la pone al fuego. Retírela ${offHeat === null ? `en el tiempo de la columna «${column}»` : `a los ${offHeat}`}, o antes si empieza a gorgotear.`,
      cool: 'Enfríe el depósito bajo el grifo de agua fría, sujetándola solo por el asa, y sirva.',
    },
    unsuitableHeading: 'No adecuada',
    onHeat: {
      gas: 'en gas',
      electric: 'en placa eléctrica',
      induction: 'en inducción',
    } satisfies Record<HeatKind, string>,
    unsuitable: (cups: string, onHeat: string, reason: string): string =>
      `La cafetera de ${cups} ${onHeat}: ${reason}.`,
  },
  index: {
    title: 'Fichas de preparación para cafetera',
    intro: (business: string): string =>
      `Todas las fichas que imprime ${business}, calculadas a partir de las medidas de la cafetera, el café y el fuego. Imprima cada una en una sola página.`,
    sets: 'Juegos de fichas',
    station: 'Fichas de barra',
    insert: 'Fichas para la bolsa',
    page: 'Página web',
    pdf: 'PDF',
    open: 'abrir',
    download: 'descargar',
    pot: 'Cafetera',
    coffee: 'Café',
    stove: 'Fuego',
    refused: 'sin receta',
    more: 'Para el manual de formación',
    method: 'Cómo funciona la cafetera',
    troubleshooting: 'Cuando algo sale mal',
    rowDetails: 'Ficha completa por fila',
  },
  nav: {
    home: 'Todas las fichas',
    method: 'Cómo funciona la cafetera',
    troubleshooting: 'Cuando algo sale mal',
    print: 'Imprima esta ficha en una sola página.',
  },
};

const method: Messages['method'] = {
  title: 'Cómo funciona la cafetera',
  sections: [
    {
      heading: 'Una caldera cerrada',
      paragraphs: [
        'Una vez enroscada la cafetera, el depósito contiene agua y, encima, una bolsa de aire y vapor de agua. La única salida es hacia arriba, por el tubo del embudo, a través del café y hasta el colector.',
        'Al calentarse el depósito, esa bolsa de gas empuja cada vez más el agua y la hace subir por el tubo. Empujan dos cosas: el aire, que se dilata al calentarse, y el vapor, cuya presión sube deprisa cuando el agua se acerca a la ebullición.',
      ],
    },
    {
      heading: 'Por qué las fichas empiezan con agua caliente',
      paragraphs: [
        'Si se llena con agua fría, casi todo el empuje viene de calentar el aire encerrado. El aire empuja en cuanto se calienta, así que el café empieza a salir pronto, cuando el agua aún está muy por debajo de la temperatura de extracción. La primera parte de la taza se extrae fría.',
        'Si se llena con agua caliente, queda menos aire encerrado: el espacio sobre el agua caliente ya está cargado de vapor. El empuje viene entonces sobre todo del vapor, que solo aumenta cuando el agua está cerca de hervir, así que el café empieza a salir cerca de la temperatura de extracción.',
        'La temperatura del hervidor de cada ficha es la que, según el modelo, extrae la mayor parte de la taza dentro del objetivo de temperatura del café.',
      ],
    },
    {
      heading: 'Qué marca el ritmo',
      paragraphs: [
        'El agua atraviesa la cama de café como cualquier lecho poroso (ley de Darcy): el caudal es la presión a través de la cama por su permeabilidad y su superficie, dividido por la viscosidad del agua y el espesor de la cama.',
        'La molienda y el grado de compactación fijan la permeabilidad. Una molienda más fina o una cama prensada deja pasar menos agua a la misma presión, así que la extracción es más lenta y la presión del depósito sube más. Por eso las fichas dicen que no se prense nunca, y por eso una molienda demasiado fina puede dejar una ficha sin receta.',
        'La posición del fuego fija lo deprisa que sube la presión; el llenado fija cuánta agua hay antes de que el depósito se vacíe.',
      ],
    },
    {
      heading: 'El final de la extracción',
      paragraphs: [
        'Cuando el agua del depósito baja hasta el extremo inferior del tubo del embudo, el gas se abre paso: la cafetera gorgotea y borbotea. La última agua que sube es la más caliente, y detrás viene el vapor.',
        'Retirar antes la cafetera del fuego y enfriar el depósito bajo el grifo de agua fría corta la extracción antes de ese final áspero. El momento de retirarla de cada ficha se elige para la mayor parte de la taza en el objetivo.',
      ],
    },
    {
      heading: 'Lo que el modelo deja fuera',
      paragraphs: [
        'Las fichas salen de un modelo sencillo: el agua se toma como bien mezclada, el depósito como un cilindro de paredes rectas, la cama como rígida, y el ancho de la llama o de la placa se reduce a un solo rendimiento. Por eso los tiempos se dan como intervalos. Un registro de preparaciones cronometradas los afina.',
      ],
    },
  ],
  exampleHeading: 'Un ejemplo de estas fichas',
  example: (a: {
    coffee: string;
    pot: string;
    stove: string;
    start: string;
    planFirst: string;
    planShare: string;
    coldFirst: string;
    coldShare: string;
    band: string;
  }): string =>
    `${a.coffee} en ${a.pot} sobre ${a.stove}: empezando con agua fría, el primer café llega al colector hacia ${a.coldFirst} y el ${a.coldShare} de la taza se extrae a ${a.band}. Empezando a ${a.start}, como dice la ficha, el primer café llega hacia ${a.planFirst} y el ${a.planShare} de la taza se extrae a ${a.band}.`,
};

const troubleshooting: Messages['troubleshooting'] = {
  title: 'Cuando algo sale mal',
  intro:
    'Cada problema se relaciona con los datos que lo mueven en el modelo que hay detrás de las fichas. Cambie una sola cosa cada vez, partiendo de la receta de la propia ficha.',
  columns: { symptom: 'Qué ve', cause: 'Qué dice el modelo', change: 'Qué cambiar' },
  rows: [
    {
      symptom: 'Gorgotea y borbotea pronto',
      cause:
        'El depósito se vació deprisa hasta el extremo del tubo del embudo: el fuego es demasiado fuerte para esta cafetera, la cama deja pasar el agua con demasiada facilidad (molienda gruesa), o había menos agua de la que dice la ficha.',
      change:
        'Llene hasta la marca de la ficha, use la posición de la ficha o una menos, y compruebe que la molienda no es más gruesa que la de la ficha.',
    },
    {
      symptom: 'Sale muy despacio, o no sale nada',
      cause:
        'La cama está demasiado compacta: la molienda es demasiado fina, el café se prensó o el filtro se llenó en exceso. Una cama compacta frena la salida y la presión sube en el depósito. Un fuego demasiado bajo también frena la subida.',
      change:
        'Muela más grueso, llene el filtro enrasado sin prensar y use la posición de la ficha. Si sigue lento, retírela del fuego y déjela enfriar antes de abrir.',
    },
    {
      symptom: 'Sabe amargo o áspero',
      cause:
        'Demasiada parte de la taza se extrajo por encima del objetivo: la cafetera siguió al fuego hasta el borboteo, cuando pasan el agua más caliente y el vapor.',
      change:
        'Retírela del fuego en el tiempo de la ficha o al primer gorgoteo, y enfríe el depósito enseguida bajo el grifo de agua fría.',
    },
    {
      symptom: 'Sabe flojo, aguado o ácido',
      cause:
        'Demasiada parte de la taza se extrajo por debajo del objetivo: el agua empezó fría, así que el café salió pronto y frío, o la cama era demasiado abierta (molienda gruesa, filtro sin llenar).',
      change:
        'Empiece con el agua a la temperatura de la ficha, llene el filtro hasta el borde y use la molienda de la ficha.',
    },
  ],
  movesHeading: 'Qué dato mueve qué',
  movesIntro: (pot: string, coffee: string, stove: string): string =>
    `Calculado por el modelo para ${coffee} en ${pot} sobre ${stove}, cambiando un solo dato de la receta de la ficha cada vez:`,
  movesColumns: {
    change: 'Cambio',
    firstCoffee: 'Primer café',
    meanTemperature: 'Temperatura media',
    inBand: 'Parte en el objetivo',
    peak: 'Presión máxima',
  },
  moves: {
    baseline: 'La receta de la ficha',
    finer: 'Molienda más fina (cama un 30 % más compacta)',
    coarser: 'Molienda más gruesa (cama un 30 % más abierta)',
    lessWater: 'Una quinta parte menos de agua',
    moreHeat: 'Una posición más alta',
    lessHeat: 'Una posición más baja',
    coldStart: 'Agua fría en vez de caliente',
  },
  noCoffee: 'ninguno antes de retirarla',
};

const plan: Messages['plan'] = {
  inductionNeedsMagneticBase: (potName: string): RefusalText => ({
    code: 'induction-needs-magnetic-base',
    reason: `${potName}: una placa de inducción no calienta su depósito de aluminio.`,
    suggestion:
      'Use una cafetera con depósito de acero inoxidable (magnético), o prepare esta en gas o en placa eléctrica. Si el depósito de esta cafetera lleva una placa de acero para inducción, indíquelo en su descripción y las fichas la usarán en inducción.',
  }),
  fillAboveValve: (asked: string, limit: string, margin: string): RefusalText => ({
    code: 'fill-above-valve',
    reason: `${asked} de agua subirían hasta la válvula de seguridad o por encima al calentarse y dilatarse.`,
    suggestion: `Llene como mucho ${limit} (el nivel queda ${margin} por debajo de la válvula en caliente).`,
  }),
  pressureNearValve: (peak: string, valve: string, grind: GrindClass): RefusalText => ({
    code: 'pressure-near-valve',
    reason: `Incluso en la posición más suave la presión llegaría a ${peak}, más de la mitad de los ${valve} de la válvula: la cama es demasiado compacta para esta cafetera.`,
    suggestion:
      grind === 'coarse'
        ? 'Use un café más abierto (menor densidad aparente o una molienda fresca y menos compacta) o una cafetera con un filtro más grande.'
        : `Muela más grueso (molienda ${grindNames[coarser[grind]]} en vez de ${grindNames[grind]}) y no prense nunca el filtro.`,
  }),
  noDelivery: (): RefusalText => ({
    code: 'no-delivery',
    reason: 'Ninguna posición hace subir el café al colector antes de que se acabe el agua.',
    suggestion: 'Llene el depósito más cerca de la marca o use una molienda más gruesa.',
  }),
  noPlanFits: (low: string, high: string, tooFast: boolean): RefusalText => ({
    code: 'no-plan-fits',
    reason: `Ninguna posición mantiene la salida del café entre ${low} y ${high}.`,
    suggestion: tooFast
      ? 'El café pasa demasiado deprisa: muela más fino o use una posición de fuego más baja.'
      : 'El café pasa demasiado despacio: muela más grueso o use una posición de fuego más alta.',
  }),
  outsideCheckedRange: (what: CheckedQuantity, value: string, low: string, high: string): string =>
    `${quantityNames[what]}, ${value}, está fuera del rango en que se comprobó el modelo (de ${low} a ${high}); tome los tiempos como aproximados.`,
  coolCup: (share: string): string =>
    `Solo el ${share} de la taza llega al objetivo de temperatura: incluso la posición más suave extrae demasiado deprisa en esta cafetera para el agua caliente. Una llama más baja o un difusor de calor permitirían empezar más caliente.`,
  smallFill: (): string =>
    'El llenado apenas supera el tubo del embudo; el modelo no se comprobó para preparaciones tan pequeñas.',
};

const stoveKindNamesEs: Record<StoveKind, string> = {
  gas: 'Fuego de gas',
  'electric-coil': 'Placa eléctrica de resistencia',
  radiant: 'Vitrocerámica (radiante)',
  induction: 'Placa de inducción',
};

const planner: Messages['planner'] = {
  pageTitle: (coffee: string): string => `Prepare ${coffee} en su propia cafetera`,
  intro:
    'Díganos cómo son su cafetera, su fuego y su hervidor. La página calcula la receta aquí, en su navegador, con el mismo cálculo que nuestras fichas impresas; no se envía nada.',
  noScript:
    'Esta página necesita JavaScript para calcular una receta. Las fichas impresas y sus PDF funcionan sin él.',
  pot: {
    legend: 'Su cafetera',
    cups: 'Tamaño de la cafetera',
    cupsOption: (cups: number, name: string): string =>
      `${cups} ${cups === 1 ? 'taza' : 'tazas'} (como nuestra ${name})`,
    own: 'Otra cafetera: la mediré',
    ownIntro:
      'Mida por dentro, con el embudo fuera. Basta con una regla de cocina y una jarra medidora; el dibujo muestra dónde va cada medida.',
    drawingAlt:
      'Dibujo en corte de una cafetera italiana: A ancho interior del depósito, B del fondo al borde inferior de la válvula de seguridad, C del fondo a lo alto del caño, D ancho y E profundidad del filtro, F ancho interior del tubo del embudo, G separación entre el extremo del tubo y el fondo.',
    ownCups: 'Tazas con que se vende',
    fields: {
      sealed_volume_ml: 'Depósito lleno hasta el borde (con el embudo puesto), mL',
      sealed_volume_floz: 'Depósito lleno hasta el borde (con el embudo puesto), fl oz',
      inner_diameter_mm: 'A: ancho interior del depósito, mm',
      inner_diameter_in: 'A: ancho interior del depósito, in',
      valve_height_mm: 'B: del fondo al borde inferior de la válvula, mm',
      valve_height_in: 'B: del fondo al borde inferior de la válvula, in',
      spout_height_mm: 'C: del fondo a lo alto del caño, mm',
      spout_height_in: 'C: del fondo a lo alto del caño, in',
      basket_diameter_mm: 'D: ancho interior del filtro, mm',
      basket_diameter_in: 'D: ancho interior del filtro, in',
      basket_depth_mm: 'E: profundidad del filtro, mm',
      basket_depth_in: 'E: profundidad del filtro, in',
      tube_inner_diameter_mm: 'F: ancho interior del tubo del embudo, mm',
      tube_inner_diameter_in: 'F: ancho interior del tubo del embudo, in',
      tube_gap_mm: 'G: del extremo del tubo al fondo, con el embudo puesto, mm',
      tube_gap_in: 'G: del extremo del tubo al fondo, con el embudo puesto, in',
      capacity_ml: 'Parte superior llena, mL',
      capacity_floz: 'Parte superior llena, fl oz',
      mass_g: 'Depósito en la báscula de cocina, g',
      material: 'Metal del depósito',
    },
    materials: {
      aluminium: 'Aluminio (gris mate, ligero)',
      'stainless-steel': 'Acero inoxidable (brillante, más pesado, sirve para inducción)',
    },
    ownName: 'Su cafetera',
  },
  stove: {
    legend: 'Su fuego',
    stove: 'Fuego',
    own: 'Otro fuego',
    kind: 'Tipo de calor',
    kinds: stoveKindNamesEs,
    power: 'Su fuerza al máximo',
    powers: {
      gentle: 'Suave: un fuego pequeño, tarda en hervir un hervidor',
      usual: 'Normal: un fuego doméstico corriente',
      strong: 'Fuerte: un quemador grande o de wok',
    },
    ownName: (kind: StoveKind, power: StovePower): string =>
      `Su ${stoveKindNamesEs[kind].toLowerCase()} (${{ gentle: 'suave', usual: 'normal', strong: 'fuerte' }[power]} al máximo), mando del 1 al 6`,
  },
  kettle: {
    legend: 'Su hervidor',
    presets: (units: UnitSystem): string =>
      `Sus temperaturas programadas, ${units === 'us' ? '°F' : '°C'}, separadas por comas (déjelo vacío si solo hierve)`,
    altitude: (units: UnitSystem): string =>
      `Altitud sobre el nivel del mar, ${units === 'us' ? 'ft' : 'm'}`,
  },
  form: {
    missing: 'Hace falta para la receta: mídalo como muestra el dibujo.',
    fillIn: 'Rellene todas las medidas de su cafetera para ver su receta.',
    badList: (text: string): string =>
      `«${text}» no es una lista de números. Escriba las temperaturas como números separados por comas, como 70, 80, 90, o deje el campo vacío`,
    badAltitude: (text: string, units: UnitSystem): string =>
      units === 'us'
        ? `«${text}» no es una altitud para la que esta página pueda calcular. Escriba un número de pies de -1640 a 16400`
        : `«${text}» no es una altitud para la que esta página pueda calcular. Escriba un número de metros de -500 a 5000`,
  },
  answer: {
    heading: 'Su receta',
    startC: 'Agua antes de cerrar',
    fillMl: 'Agua en el depósito',
    doseG: 'Café en el filtro',
    level: 'Posición del fuego',
    firstCoffeeS: 'Primer café',
    offHeatS: 'Retirar del fuego',
    yieldMl: 'En la taza',
    refused: 'Sin receta',
    working: 'Calculando su receta…',
    print: 'Imprimir esta ficha',
    share: 'La dirección de esta página guarda sus elecciones: añádala a favoritos o envíela.',
    fixFirst: 'Corrija los campos marcados para ver una receta.',
  },
  timer: {
    heading: 'Cronómetro: cuéntenos cómo le salió',
    intro:
      'Ponga en marcha el cronómetro cuando la cafetera vaya al fuego y pulse cada botón cuando ocurra. La página escribe la preparación en el formato de registro con el que ajustamos las fichas; cópiela o guárdela como archivo.',
    heatOn: 'Al fuego',
    firstCoffee: 'Primer café',
    sputter: 'Borboteo',
    offHeat: 'Retirada del fuego',
    reset: 'Empezar de nuevo',
    level: 'Posición del fuego usada',
    fill: (units: UnitSystem): string => `Agua en el depósito, ${units === 'us' ? 'fl oz' : 'mL'}`,
    start: (units: UnitSystem): string =>
      `Temperatura del agua al cerrar, ${units === 'us' ? '°F' : '°C'}`,
    room: (units: UnitSystem): string => `Temperatura ambiente, ${units === 'us' ? '°F' : '°C'}`,
    cup: 'Café en la taza al final, g',
    output: 'La preparación, como entrada del registro',
    copy: 'Copiar',
    download: 'Guardar como archivo',
    copied: 'Copiado.',
    notStarted: 'Pulse primero «Al fuego».',
    stopped: 'La preparación ha terminado: pulse «Empezar de nuevo» para otra.',
    elapsed: (seconds: number): string => `${seconds} s al fuego`,
    mark: (what: string, seconds: number): string => `${what} a los ${seconds} s`,
    needEnd: 'Pulse «Borboteo» o «Retirada del fuego» para terminar la preparación.',
    needFirst: 'Pulse «Primer café» cuando aparezca el primer café.',
    ownPotNote:
      'Su cafetera no está en nuestra lista: la entrada la llama «your-pot»; envíenos también sus medidas.',
    comment: (pot: string, coffee: string, stove: string): string =>
      `Cronometrado en la página de preparación: ${pot}, ${coffee}, ${stove}.`,
  },
};

const pdf: Messages['pdf'] = {
  creator: 'stovecard',
  stationTitle: (coffee: string, subtitle: string): string => `${coffee} — ${subtitle}`,
  insertTitle: (coffee: string): string => `${coffee} — ficha para la bolsa`,
  setTitle: (set: string): string => set,
  sheetTitle: (set: string, up: number, paper: string): string =>
    `${set} — ${up} por hoja ${paper}`,
  crossSectionAlt: (title: string, fillLine: string): string => `${title}. ${fillLine}`,
  qrAlt: (url: string): string => `Código QR de ${url}`,
  stepNumber: (n: number): string => `${n}`,
  listNumber: (n: number): string => `${n}.`,
  bullet: '•',
  contents: {
    heading: 'Índice',
    intro: (count: number): string =>
      count === 1
        ? 'Una ficha, en su propia página.'
        : `${count} fichas, cada una en su propia página.`,
    frontMatter: 'Antes de las fichas',
    cards: 'Las fichas',
    station: (title: string, subtitle: string): string => `${title}, ${subtitle}`,
    refused: (line: string, status: string): string => `${line} (${status})`,
  },
  doesNotFit: (cardName: string, paper: string, usedPt: number, availablePt: number): string =>
    `la ficha «${cardName}» no cabe en una página ${paper} con todos los textos a 7 pt o más, ni siquiera sin sus bloques opcionales (${Number.isFinite(usedPt) ? `${Math.ceil(usedPt)} pt de texto para ${Math.floor(availablePt)} pt` : `necesita más de los ${Math.floor(availablePt)} pt que tiene la página`}): imprímala en papel más grande (paper: en site.yaml, o en su juego), ponga menos cafeteras o fuegos en el juego de fichas para la bolsa (pots:, stoves:) o acorte su texto más largo en el YAML (un nombre, las notas).`,
  pageNumber: (n: number, total: number): string => `${n} / ${total}`,
};

const print: Messages['print'] = {
  binderLabel: 'Manual de formación',
  paperNames: {
    A4: 'A4',
    A5: 'A5',
    A6: 'A6',
    letter: 'carta',
    'half-letter': 'media carta',
    '4x6in': '4 × 6 in',
  },
  setPdf: (binder: boolean): string =>
    binder
      ? 'Todo el manual en un PDF: sus páginas de formación y luego las fichas.'
      : 'Todas las fichas de este juego en un PDF, una por página.',
  sheetPdf: 'Hojas (PDF)',
  sheetLink: (up: number, paper: string): string =>
    `Para una impresora de escritorio: ${up} fichas en cada hoja ${paper}, con marcas de corte.`,
  leftOut: (codes: readonly RefusalCode[]): string | null => {
    if (codes.length === 0) return null;
    const counts = new Map<RefusalCode, number>();
    for (const code of codes) counts.set(code, (counts.get(code) ?? 0) + 1);
    const reasons = [...counts.entries()]
      .map(([code, n]) => `${n} × ${card.refusal.short[code]}`)
      .join('; ');
    return codes.length === 1
      ? `No se incluye en este juego una combinación de cafetera y café que no tendría receta (${reasons}).`
      : `No se incluyen en este juego ${codes.length} combinaciones de cafetera y café que no tendrían receta (${reasons}).`;
  },
};

const MAKER_ES =
  'Siga las instrucciones del fabricante de la cafetera; donde difieran de esta página, mandan ellas.';

const binder: Messages['binder'] = {
  cover: {
    kind: 'Manual de formación',
    from: (business: string): string => `De ${business}`,
    built: (date: string): string => `Fichas calculadas el ${date}.`,
    intro:
      'Cómo funciona una cafetera italiana, cómo preparar el café con las fichas, cómo cuidar la cafetera y una hoja de registro para las preparaciones que cronometre. Téngalo a mano junto a la barra.',
  },
  steps: {
    title: 'Cada paso y su porqué',
    intro:
      'Las fichas dan estos pasos con las cifras de una cafetera, un café y un fuego concretos. Aquí se explica por qué está cada paso.',
    items: [
      {
        step: 'Caliente el agua en un hervidor a la temperatura de la ficha.',
        why: 'El agua caliente encierra menos aire, así que el café empieza a salir cerca de la temperatura de extracción y no antes de tiempo y frío. La temperatura de la ficha es la que extrae la mayor parte de la taza dentro del objetivo del café.',
      },
      {
        step: 'Llene el depósito hasta la marca, justo bajo la válvula; nunca por encima.',
        why: 'El agua se dilata al calentarse. El llenado de la ficha deja sitio para ello bajo la válvula, y agua suficiente para terminar la preparación antes de que el depósito se quede seco.',
      },
      {
        step: 'Llene el filtro enrasado con el borde; no lo prense.',
        why: 'Una cama enrasada y suelta deja pasar el agua al ritmo para el que se calculó la ficha. Una cama prensada o colmada es más compacta: la extracción se frena y la presión del depósito sube.',
      },
      {
        step: 'Enrosque bien la parte superior, sujetando el depósito caliente con un paño.',
        why: 'Una unión floja deja escapar vapor y café, y la cafetera no llega a dar el empuje que espera la ficha. El depósito ya está caliente por el agua del hervidor.',
      },
      {
        step: 'Póngala al fuego en la posición de la ficha, con una llama que no sobresalga del depósito.',
        why: 'La posición marca lo deprisa que sube la presión. Una llama más ancha que el depósito calienta el asa y la parte superior, no el agua.',
      },
      {
        step: 'Retírela en el tiempo de la ficha, o antes si empieza a gorgotear.',
        why: 'Al final sube el agua más caliente y detrás llega el vapor: esa parte de la taza sabe áspera.',
      },
      {
        step: 'Enfríe el depósito bajo el grifo de agua fría, sujetándola solo por el asa, y sirva.',
        why: 'Al enfriarlo, la presión del depósito cae enseguida: la extracción se detiene y la cafetera se puede abrir sin peligro.',
      },
    ],
  },
  cleaning: {
    title: 'Limpieza y mantenimiento',
    intro:
      'Siga las instrucciones del fabricante de su cafetera; donde no coincidan con esta página, mandan las del fabricante. Deje que la cafetera se enfríe del todo antes de desmontarla.',
    items: [
      {
        part: 'Después de cada uso',
        care: 'Vacíe el poso, enjuague cada pieza con agua templada y déjelas secar por separado. El jabón y el lavavajillas oscurecen el aluminio; muchos fabricantes desaconsejan ambos.',
      },
      {
        part: 'Junta',
        care: 'El aro de goma bajo la parte superior cierra la cafetera. Revísela cada semana: si está agrietada, dura o aplastada, o si se escapa café o vapor por la unión, cámbiela por una de la medida del fabricante.',
      },
      {
        part: 'Placa filtrante',
        care: 'El disco perforado que sujeta la junta. Enjuáguela y mírela a contraluz: desatasque los orificios con un cepillo suave, nunca con un alfiler, que los agranda.',
      },
      {
        part: 'Válvula de seguridad',
        care: 'Manténgala limpia y no llene nunca por encima de ella, ni la tape ni la obstruya. Si el fabricante indica que se puede mover, compruebe que su vástago se mueve libremente. Si la válvula gotea, se atasca o ha soltado vapor durante una preparación, deje de usar la cafetera y pida al fabricante una válvula o un depósito nuevos.',
      },
      {
        part: 'Cal',
        care: 'El agua dura deja una costra blanca en el depósito. Elimínela como indique el fabricante; después prepare una cafetera y tire ese café.',
      },
    ],
  },
  glossary: {
    title: 'Palabras de las fichas',
    items: [
      { term: 'Depósito', meaning: 'La parte inferior, la que contiene el agua.' },
      {
        term: 'Embudo y filtro',
        meaning: 'El filtro contiene el café molido; su tubo baja hasta el agua del depósito.',
      },
      { term: 'Colector', meaning: 'La parte superior, donde llega el café.' },
      {
        term: 'Válvula de seguridad',
        meaning:
          'La pequeña válvula del costado del depósito. Deja salir vapor si la presión sube demasiado. El agua debe quedar siempre por debajo de ella.',
      },
      {
        term: 'Nivel de llenado',
        meaning: 'El nivel de agua que indica la ficha, justo bajo la válvula.',
      },
      {
        term: 'Junta',
        meaning: 'El aro de goma que cierra la unión de la parte superior y el depósito.',
      },
      { term: 'Placa filtrante', meaning: 'El disco perforado que queda bajo la junta.' },
      {
        term: 'Primer café',
        meaning:
          'El momento en que asoma el café por el caño, contado desde que la cafetera se pone al fuego.',
      },
      {
        term: 'Gorgoteo, borboteo',
        meaning:
          'El ruido de la cafetera cuando queda poca agua en el depósito y el vapor se abre paso: el final de la preparación.',
      },
      {
        term: 'Retirar del fuego',
        meaning: 'Cuándo apartar la cafetera del fuego, contado desde que se pone al fuego.',
      },
      {
        term: 'Objetivo',
        meaning:
          'El intervalo de temperatura del agua en que mejor se extrae el café; las fichas buscan extraer la mayor parte de la taza dentro de él.',
      },
      {
        term: 'Posición',
        meaning: 'Cada punto del mando del fuego, escrito como en el mando.',
      },
      {
        term: 'Registro de preparaciones',
        meaning:
          'La anotación de preparaciones cronometradas; permite recalcular las fichas para su propia cafetera, su café y su fuego.',
      },
    ],
  },
  logSheet: {
    title: 'Hoja de registro de preparaciones',
    intro:
      'Una hoja por cafetera, café y fuego. Cuente el tiempo desde que la cafetera se pone al fuego. Deje en blanco lo que no haya medido; cada preparación necesita al menos uno de los tiempos, el café obtenido o las lecturas.',
    brewColumn: 'N.º',
    readingsIntro: (label: string): string =>
      `${label}: un tiempo y una lectura por pareja, por orden de tiempo.`,
    usNote:
      'Los archivos de registro llevan valores métricos: convierta estas lecturas al pasarlas a ellos (content/README.md, registros de preparaciones).',
    time: 'Tiempo, s',
    brewRows: 6,
    readingPairs: 4,
    logFields: {
      pot: 'Cafetera',
      coffee: 'Café',
      stove: 'Fuego',
      altitude_m: 'Altitud, m',
      level: 'Posición',
      fill_ml: 'Agua puesta, mL',
      start_c: 'Agua al cerrar, °C',
      room_c: 'Ambiente, °C',
      first_coffee_s: 'Primer café, s',
      sputter_s: 'Gorgoteo, s',
      off_heat_s: 'Retirada, s',
      yield_ml: 'Café obtenido, mL',
      cup_g: 'Taza en la báscula, g',
      water_c: 'Agua del depósito, °C',
    } as Record<string, string>,
    logFieldsUs: {
      pot: 'Cafetera',
      coffee: 'Café',
      stove: 'Fuego',
      altitude_m: 'Altitud, ft',
      level: 'Posición',
      fill_ml: 'Agua puesta, fl oz',
      start_c: 'Agua al cerrar, °F',
      room_c: 'Ambiente, °F',
      first_coffee_s: 'Primer café, s',
      sputter_s: 'Gorgoteo, s',
      off_heat_s: 'Retirada, s',
      yield_ml: 'Café obtenido, fl oz',
      cup_g: 'Taza en la báscula, oz',
      water_c: 'Agua del depósito, °F',
    } as Record<string, string>,
    readingUnit: (label: string): string => label.split(', ').pop() ?? label,
    filledBy: 'Cronometrado por',
    date: 'Fecha',
  },
  exercises: {
    title: 'Ejercicios',
    intro:
      'Tareas prácticas con las fichas de este manual, una cada vez y con el formador al lado. Cada una dice qué anotar y cómo es un buen resultado; traiga sus notas a la validación.',
    none: 'Ninguna ficha de este manual tiene receta, así que aún no hay nada que practicar: pida a quien lleva las fichas un manual con una ficha que prepare café.',
    cardLabel: 'Ficha',
    goalLabel: 'Objetivo',
    stepsLabel: 'Pasos',
    recordLabel: 'Anote',
    goodLabel: 'Un buen resultado',
    safetyLabel: 'Seguridad',
    tableCard: (coffee: string, pot: string, stove: string): string =>
      `${coffee} en ${pot} sobre ${stove}`,
    hotCold: (
      f: ExerciseCardFacts,
      inBand: { readonly label: string; readonly value: string },
    ): ExerciseText => ({
      heading: 'Agua fría frente al agua caliente de la ficha',
      goal: `Compruebe por qué la ficha empieza con agua a ${f.temperature}: prepare su receta una vez con agua fría del grifo y otra como dice la ficha, y compárelas.`,
      steps: [
        `En frío: llene el depósito con ${f.fill} ${f.fillMass} de agua fría del grifo y el filtro con ${f.dose} de café, enrasado y sin prensar; cierre la cafetera y póngala en la posición ${f.level}. Ponga en marcha el cronómetro al ponerla al fuego.`,
        'Retírela al primer gorgoteo, enfríe el depósito bajo el grifo de agua fría y sirva.',
        `En caliente: cuando la cafetera se haya enfriado, enjuáguela y prepárela de nuevo como dice la ficha: agua a ${f.temperature}, ${f.fill}, ${f.dose}, posición ${f.level}, retirada a ${f.offHeat} o al primer gorgoteo.`,
      ],
      record: [
        'De cada preparación: el tiempo del primer café, el del primer gorgoteo y el café en la taza (con una jarra medidora, o con una báscula tarando la taza: un gramo es casi un mililitro).',
        'Cómo sabe cada taza, en pocas palabras.',
      ],
      good: `El primer café de la preparación en caliente sale dentro de los ${f.firstCoffee} de la ficha y su taza tiene unos ${f.yield}. El de la preparación en frío sale más tarde y sabe más plano o más áspero; la línea «${inBand.label}» de la ficha dice: ${inBand.value}.`,
      safety: `El agua, el depósito y el café queman: sujete el depósito con un paño, no abra nunca una cafetera al fuego y mantenga la llama sin sobresalir del depósito. ${MAKER_ES}`,
    }),
    finer: (
      f: ExerciseCardFacts,
      card: ExerciseMoveFacts,
      finer: ExerciseMoveFacts,
      tableCard: string | null,
    ): ExerciseText => ({
      heading: 'Un punto más fino',
      goal: 'Compare la tabla de problemas «Qué dato mueve qué» con una cafetera real: muela un punto más fino y vea si la preparación cambia como dice la tabla.',
      steps: [
        `Prepare la ficha como dice (agua a ${f.temperature}, ${f.fill}, ${f.dose}, posición ${f.level}) y cronometre el primer café.`,
        'Ponga el molino un punto más fino, no cambie nada más y prepárela de nuevo. Llene el filtro enrasado como siempre; no prense.',
        `Retire cada preparación a ${f.offHeat} o al primer gorgoteo.`,
      ],
      record: [
        'De cada preparación: el tiempo del primer café y del primer gorgoteo, el café en la taza y cómo sabe.',
        'Lo que predice la tabla junto a lo que ha visto, y si la válvula ha silbado.',
      ],
      good: `${tableCard === null ? 'La tabla, calculada para esta ficha' : `La tabla, calculada para ${tableCard} (espere el mismo sentido aquí, no los mismos tiempos)`}, dice: ${card.change}, primer café ${card.firstCoffee}, presión máxima ${card.peak}; ${finer.change}, primer café ${finer.firstCoffee}, presión máxima ${finer.peak}. Su preparación más fina cambia en el mismo sentido, y sabe decir cuánto se apartan sus tiempos de los de la tabla.`,
      safety: `Una molienda más fina frena el agua y sube la presión en el depósito. Si la válvula suelta vapor o el café deja de salir, retire la cafetera del fuego, enfríe el depósito bajo el grifo de agua fría y no muela más fino. No prense nunca. ${MAKER_ES}`,
    }),
    fillLine: (f: ExerciseCardFacts, fillLine: string): ExerciseText => ({
      heading: 'La marca de llenado y la válvula',
      goal: `Saber dónde debe quedar el agua en ${f.pot} y dónde está su válvula de seguridad, con una cafetera fría y vacía que nunca se pone al fuego.`,
      steps: [
        `Tome ${f.pot}, fría y vacía, lejos del fuego. Desenrósquela y saque el filtro.`,
        'Busque la válvula de seguridad en el lateral del depósito, por fuera y por dentro. No la desmonte.',
        `Eche ${f.fill} de agua fría y mida el nivel con una regla. La ficha dice: ${fillLine}`,
        'Eche más agua, despacio, por encima de la marca hasta que llegue a la parte baja de la válvula, y anote cuánta más ha hecho falta. Después tire toda el agua.',
      ],
      record: [
        'La altura del llenado de la ficha, el agua que ha hecho falta para llegar a la válvula y dónde está la válvula.',
      ],
      good: `Los ${f.fill} de la ficha quedan donde dice la ficha, y sabe señalar la marca y la válvula sin la ficha. Con muy poca agua más se llega a la válvula: por eso nunca se pasa la marca.`,
      safety: `No ponga nunca este depósito al fuego: un depósito llenado por encima de la marca se vacía, no se prepara. El agua por encima de la válvula le impide soltar vapor. ${MAKER_ES}`,
    }),
    logThree: (f: ExerciseCardFacts, sheet: string): ExerciseText => ({
      heading: 'Tres preparaciones en la hoja de registro',
      goal: 'Cronometrar tres preparaciones de una ficha y anotarlas en la hoja de registro, para que las fichas se ajusten a su propia cafetera, su café y su fuego.',
      steps: [
        `Haga una copia de la página en blanco «${sheet}» y escriba arriba la cafetera, el café y el fuego de la ficha.`,
        `Prepare la ficha tres veces como dice (agua a ${f.temperature}, ${f.fill}, ${f.dose}, posición ${f.level}). Ponga en marcha el cronómetro al poner la cafetera al fuego; una línea por preparación.`,
        'Entregue la hoja a quien lleva las fichas: la pasa a un registro de preparaciones y vuelve a ajustar las fichas con stovecard fit.',
      ],
      record: [
        'Tres líneas de la hoja: la posición, el agua puesta y su temperatura al cerrar, el ambiente, los tiempos del primer café, del primer gorgoteo y de la retirada, y el café obtenido.',
        'Su nombre y la fecha arriba de la hoja.',
      ],
      good: `Tres líneas con los tiempos en orden (primer café, luego gorgoteo, luego retirada), el primer café dentro de los ${f.firstCoffee} de la ficha y la retirada al primer gorgoteo o dentro de sus ${f.offHeat}; al pasarla, el registro se lee sin errores.`,
      safety: `Tres preparaciones seguidas: deje enfriar la cafetera, o enfríela bajo el grifo de agua fría, antes de abrirla y volver a llenarla, y revise la junta entre una y otra. ${MAKER_ES}`,
    }),
  },
  signOff: {
    title: 'Validación de la formación',
    intro:
      'El formador marca cada punto cuando el alumno lo ha demostrado en una preparación real.',
    checks: [
      'Lee una ficha: encuentra la cafetera, el café y el fuego, y las cifras de cada paso.',
      'Calienta el agua a la temperatura de la ficha y llena el depósito hasta la marca bajo la válvula.',
      'Llena el filtro enrasado, sin prensar, y cierra la cafetera sujetando el depósito con un paño.',
      'Pone el fuego como dice la ficha, con una llama que no sobresale del depósito.',
      'Retira la cafetera en el tiempo de la ficha o al primer gorgoteo, y enfría el depósito.',
      'Limpia la cafetera y revisa la junta, la placa filtrante y la válvula.',
      'Sabe cuándo no debe usarse una cafetera, y que las instrucciones del fabricante van primero.',
      'Cronometra una preparación y rellena una línea de la hoja de registro.',
    ],
    trainee: 'Alumno',
    trainer: 'Formador',
    date: 'Fecha',
    signature: 'Firma',
  },
};

export const es: Messages = {
  langTag: 'es-ES',
  format: {
    decimal: ',',
    /** Day/month/year, "03/12/2026" (the numeric form Spain writes dates in). */
    date: (iso: string): string => {
      const [y, m, d] = iso.split('-');
      return `${d}/${m}/${y}`;
    },
  },
  card,
  method,
  troubleshooting,
  plan,
  pdf,
  print,
  binder,
  planner,
};
