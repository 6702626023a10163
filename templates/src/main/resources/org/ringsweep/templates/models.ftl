<#-- Model cards, one per distinct model. -->
<#list models as m>
<#switch m.kind>
<#case "diode">
.model ${m.name} D(IS=${m.is} N=${m.n} RS=${m.rs} CJO=${m.cjo})
<#break>
<#case "ltra">
.model ${m.name} LTRA R=${m.r} L=${m.l} G=${m.g} C=${m.c} LEN=${m.length}
<#break>
<#case "txl">
.model ${m.name} TXL R=${m.r} L=${m.l} G=${m.g} C=${m.c} length=${m.length}
<#break>
<#default>
<#stop "models.ftl does not know model kind " + m.kind>
</#switch>
</#list>
