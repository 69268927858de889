namespace Lookup.DemoGenerator.Parts;

/// <summary>Surface finishes offered by the invented supplier; the two-letter code ends every SKU.</summary>
internal enum Finish
{
    /// <summary>ZN: bright zinc plating, bluish silver.</summary>
    ZincPlated,

    /// <summary>BO: black oxide, dark and satin.</summary>
    BlackOxide,

    /// <summary>BR: solid brass, yellow.</summary>
    Brass,

    /// <summary>SS: stainless steel, neutral and bright.</summary>
    Stainless,
}
