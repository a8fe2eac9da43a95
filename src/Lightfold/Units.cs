namespace Lightfold;

/// <summary>Physical constants and unit conversions, each written once with its source.</summary>
/// <remarks>
/// Constants are CODATA 2018 (Tiesinga et al. 2021, Rev. Mod. Phys. 93, 025010), the set that
/// astropy 5.2 uses, so reference values generated with it agree to the last digits.
/// The parsec is the IAU 2015 Resolution B2 value; the year is the Julian year (IAU).
/// </remarks>
public static class Units
{
    /// <summary>Speed of light [km s⁻¹] (exact, SI definition).</summary>
    public const double SpeedOfLightKms = 299_792.458;

    /// <summary>Speed of light [cm s⁻¹] (exact).</summary>
    public const double SpeedOfLightCms = 2.99792458e10;

    /// <summary>Speed of light [Å s⁻¹] (exact).</summary>
    public const double SpeedOfLightAngstromPerS = 2.99792458e18;

    /// <summary>Newtonian constant of gravitation [m³ kg⁻¹ s⁻²] (CODATA 2018).</summary>
    public const double GravitationalConstantSi = 6.67430e-11;

    /// <summary>Newtonian constant of gravitation [cm³ g⁻¹ s⁻²] (CODATA 2018).</summary>
    public const double GravitationalConstantCgs = 6.67430e-8;

    /// <summary>Stefan–Boltzmann constant [W m⁻² K⁻⁴] (CODATA 2018, exact since the 2019 SI).</summary>
    public const double StefanBoltzmannSi = 5.670374419e-8;

    /// <summary>Stefan–Boltzmann constant [erg s⁻¹ cm⁻² K⁻⁴].</summary>
    public const double StefanBoltzmannCgs = 5.670374419e-5;

    /// <summary>Boltzmann constant [eV K⁻¹] (CODATA 2018, exact).</summary>
    public const double BoltzmannEvPerK = 8.617333262e-5;

    /// <summary>Boltzmann constant [erg K⁻¹] (CODATA 2018, exact).</summary>
    public const double BoltzmannErgPerK = 1.380649e-16;

    /// <summary>Planck constant [erg s] (CODATA 2018, exact).</summary>
    public const double PlanckErgS = 6.62607015e-27;

    /// <summary>Solar mass [g] (IAU 2015 nominal GM☉ / G with CODATA 2018 G).</summary>
    public const double SolarMassG = 1.988409870698051e33;

    /// <summary>Parsec [m] (IAU 2015 Resolution B2).</summary>
    public const double MetresPerParsec = 3.0856775814913673e16;

    /// <summary>Megaparsec [km].</summary>
    public const double KmPerMpc = MetresPerParsec * 1e6 / 1e3;

    /// <summary>Megaparsec [cm].</summary>
    public const double CmPerMpc = MetresPerParsec * 1e6 * 1e2;

    /// <summary>Parsec [cm].</summary>
    public const double CmPerParsec = MetresPerParsec * 1e2;

    /// <summary>Seconds per day (exact).</summary>
    public const double SecondsPerDay = 86_400.0;

    /// <summary>Seconds per Julian year (365.25 d, IAU).</summary>
    public const double SecondsPerYear = 365.25 * SecondsPerDay;

    /// <summary>Seconds per gigayear (Julian years).</summary>
    public const double SecondsPerGyr = 1e9 * SecondsPerYear;

    /// <summary>Arcseconds per radian.</summary>
    public const double ArcsecPerRadian = 180.0 * 3600.0 / Math.PI;

    /// <summary>Degrees per radian.</summary>
    public const double DegPerRadian = 180.0 / Math.PI;

    /// <summary>Steradians per square degree.</summary>
    public const double SteradiansPerSquareDegree = (Math.PI / 180.0) * (Math.PI / 180.0);

    /// <summary>Square degrees on the whole sky (4π sr).</summary>
    public const double SquareDegreesWholeSky = 4.0 * Math.PI / SteradiansPerSquareDegree;

    /// <summary>Centimetres per light-day.</summary>
    public const double CmPerLightDay = SpeedOfLightCms * SecondsPerDay;

    /// <summary>AB zero point of a flux in nanojansky: m = −2.5 log10(f/nJy) + 31.4 (Oke &amp; Gunn 1983, 3631 Jy).</summary>
    public const double AbZeroPointNjy = 31.4;

    /// <summary>AB magnitude zero point in f_ν cgs: m = −2.5 log10(f_ν / erg s⁻¹ cm⁻² Hz⁻¹) − 48.60 (Oke &amp; Gunn 1983, ApJ 266, 713).</summary>
    public const double AbZeroPointCgs = -48.60;

    /// <summary>erg s⁻¹ cm⁻² Hz⁻¹ per nanojansky.</summary>
    public const double CgsPerNjy = 1e-32;

    /// <summary>Converts degrees to radians.</summary>
    public static double DegToRad(double deg) => deg / DegPerRadian;
}
