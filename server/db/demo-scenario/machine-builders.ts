// Invented machine builders and their control families; no real builder or control is named.
export const demoBuilders = {
  vantor: { name: "Vantor Machine Works", controls: { mill: "Kestle 40", lathe: "Kestle 60L" } },
  halden: { name: "Halden Axis Systems", controls: { millTurn: "Halden HX-7" } },
  orrin: { name: "Orrin & Vale Toolworks", controls: { laser: "Linea 9" } },
  strell: { name: "Strell Spark Systems", controls: { edm: "Spark 5" } },
} as const;
