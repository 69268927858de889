namespace Lookup.DemoGenerator.Catalogue;

/// <summary>Where a photo is taken: the supplier's light booth or a customer's workbench.</summary>
internal enum ShotStyle
{
    Studio,
    Field,
}
