namespace Lightfold.Populations;

/// <summary>Supernova classes Lightfold simulates.</summary>
public enum TransientType
{
    /// <summary>Thermonuclear (Type Ia).</summary>
    Ia = 0,
    /// <summary>Core collapse, hydrogen-rich plateau (Type II-P).</summary>
    IIP = 1,
    /// <summary>Core collapse, hydrogen-rich linear decline (Type II-L).</summary>
    IIL = 2,
    /// <summary>Core collapse, narrow hydrogen lines (Type IIn).</summary>
    IIn = 3,
    /// <summary>Stripped envelope, helium-rich (Type Ib; IIb counted here).</summary>
    Ib = 4,
    /// <summary>Stripped envelope, helium-poor (Type Ic; peculiar Ibc counted here).</summary>
    Ic = 5,
}

/// <summary>Names of <see cref="TransientType"/> as written in configs and catalogs.</summary>
public static class TransientTypes
{
    /// <summary>All types, in catalog order.</summary>
    public static readonly TransientType[] All = [TransientType.Ia, TransientType.IIP, TransientType.IIL, TransientType.IIn, TransientType.Ib, TransientType.Ic];

    /// <summary>Catalog spelling ("Ia", "IIP", …).</summary>
    public static string Name(TransientType t) => t.ToString();

    /// <summary>All catalog spellings.</summary>
    public static readonly string[] Names = All.Select(Name).ToArray();

    /// <summary>Parses a catalog spelling (case-insensitive).</summary>
    public static TransientType Parse(string name) => All.First(t => string.Equals(Name(t), name, StringComparison.OrdinalIgnoreCase));

    /// <summary>Whether the type is a core-collapse supernova.</summary>
    public static bool IsCoreCollapse(TransientType t) => t != TransientType.Ia;
}
