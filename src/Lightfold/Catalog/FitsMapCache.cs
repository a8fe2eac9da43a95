using System.Globalization;
using System.Security.Cryptography;
using System.Text;
using Lightfold.Microlensing;

namespace Lightfold.Catalog;

/// <summary>Magnification maps stored as FITS files in a cache folder, named by a hash of every input.</summary>
/// <remarks>Folder: $LIGHTFOLD_CACHE_DIR/maps, else $XDG_CACHE_HOME/lightfold/maps, else ~/.cache/lightfold/maps.
/// Unreadable or mismatched files are ignored and rebuilt; failures to write only cost the next run the time.</remarks>
public sealed class FitsMapCache(string folder) : IMapCache
{
    /// <summary>The default per-user cache folder for maps.</summary>
    public static FitsMapCache Default()
        => new(Path.Combine(CrossSectionTableCache.Folder() ?? Path.Combine(Path.GetTempPath(), "lightfold-cache"), "maps"));

    string PathFor(MapSpec spec) => Path.Combine(folder, Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(spec.CacheKey)))[..32] + ".fits");

    /// <inheritdoc/>
    public bool TryLoad(MapSpec spec, out MagnificationMap map)
    {
        map = null!;
        string path = PathFor(spec);
        try
        {
            if (!File.Exists(path)) return false;
            var (data, w, h, keys) = FitsImage.Read(path);
            if (w != spec.Pixels || h != spec.Pixels || keys.GetValueOrDefault("LFKEYHSH") != Hash(spec)) return false;
            map = new MagnificationMap(spec, data, int.Parse(keys["NSTARS"], CultureInfo.InvariantCulture), long.Parse(keys["NRAYS"], CultureInfo.InvariantCulture));
            return true;
        }
        catch (Exception e) when (e is IOException or InvalidDataException or FormatException or KeyNotFoundException or UnauthorizedAccessException)
        {
            return false;
        }
    }

    static string Hash(MapSpec spec) => Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(spec.CacheKey)))[..16];

    /// <inheritdoc/>
    public void Save(MagnificationMap map)
    {
        try
        {
            Directory.CreateDirectory(folder);
            Write(PathFor(map.Spec), map, null);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or InputException)
        {
            // No cache this time.
        }
    }

    /// <summary>Writes a map as FITS with keywords describing it (and, if given, the Einstein radius in cm and light-days).</summary>
    public static void Write(string path, MagnificationMap map, double? einsteinRadiusCm)
    {
        var s = map.Spec;
        var keys = new List<(string, object, string)>
        {
            ("BUNIT", "magnification", "absolute magnification per pixel"),
            ("KAPPA", s.Kappa, "total convergence"),
            ("GAMMA", s.Gamma, "shear (along map x)"),
            ("KAPSTAR", s.KappaStar, "convergence in stars"),
            ("MUMACRO", s.MacroMagnification, "1/((1-kappa)^2-gamma^2)"),
            ("SIZERE", s.SizeEinsteinRadii, "map side [Einstein radii of 1 Msun]"),
            ("PIXRE", s.SizeEinsteinRadii / s.Pixels, "pixel side [Einstein radii]"),
            ("RAYSPP", s.RaysPerPixel, "mean rays per pixel"),
            ("MARGINRE", s.MarginEinsteinRadii, "source-plane margin shot [Einstein radii]"),
            ("IMF", s.Imf.Kind, "initial mass function"),
            ("MMIN", s.Imf.MinMassSolar, "lowest stellar mass [Msun]"),
            ("MMAX", s.Imf.MaxMassSolar, "highest stellar mass [Msun]"),
            ("SEED", s.Seed, "star-field seed"),
            ("NSTARS", map.Stars, "stars in the field"),
            ("NRAYS", map.Rays, "rays shot"),
            ("LFKEYHSH", Hash(s), "hash of all inputs"),
            ("ORIGIN", "lightfold", "simulated microlensing map"),
        };
        if (einsteinRadiusCm is { } re)
        {
            keys.Add(("RE_CM", re, "Einstein radius of 1 Msun on the source plane [cm]"));
            keys.Add(("RE_LDAY", re / Units.CmPerLightDay, "same [light-days]"));
        }
        FitsImage.Write(path, map.Magnification, s.Pixels, s.Pixels, keys);
    }
}
