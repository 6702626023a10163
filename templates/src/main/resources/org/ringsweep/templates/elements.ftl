<#-- One line per circuit primitive. Names are safe identifiers, numbers preformatted (never SPICE suffixes). -->
<#list elements as e>
<#switch e.kind>
<#case "resistor">
R${e.name} ${e.a} ${e.b} ${e.value}
<#break>
<#case "capacitor">
C${e.name} ${e.a} ${e.b} ${e.value}
<#break>
<#case "inductor">
L${e.name} ${e.a} ${e.b} ${e.value}
<#break>
<#case "dc">
V${e.name} ${e.a} ${e.b} DC ${e.value}
<#break>
<#case "pwl">
V${e.name} ${e.a} ${e.b} PWL(<#list e.points as p>${p.t} ${p.v}<#sep> </#sep></#list>)
<#break>
<#case "timedResistor">
B${e.name} ${e.a} ${e.b} I = v(${e.a},${e.b})/pwl(time, <#list e.points as p>${p.t}, ${p.v}<#sep>, </#sep></#list>)
<#break>
<#case "tableCurrent">
B${e.name} ${e.a} ${e.b} I = <#if e.scale?has_content>pwl(time, <#list e.scale as p>${p.t}, ${p.v}<#sep>, </#sep></#list>) * </#if>pwl(v(${e.cp},${e.cm}), <#list e.points as p>${p.t}, ${p.v}<#sep>, </#sep></#list>)
<#break>
<#case "lossless">
T${e.name} ${e.a} ${e.aRef} ${e.b} ${e.bRef} Z0=${e.z0} TD=${e.delay}
<#break>
<#case "ltra">
O${e.name} ${e.a} ${e.aRef} ${e.b} ${e.bRef} ${e.model}
<#break>
<#case "txl">
Y${e.name} ${e.a} ${e.aRef} ${e.b} ${e.bRef} ${e.model}
<#break>
<#case "diode">
D${e.name} ${e.a} ${e.b} ${e.model}
<#break>
<#case "subcircuit">
.subckt ${e.subckt} ${e.ports}
<#list e.lines as l>
${l}
</#list>
.ends ${e.subckt}
X${e.name} ${e.ports} ${e.subckt}
<#break>
<#default>
<#stop "elements.ftl does not know element kind " + e.kind>
</#switch>
</#list>
