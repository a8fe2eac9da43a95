namespace Lightfold.Catalog;

/// <summary>Every catalog column name, declared once (snake_case with the unit as suffix; see DESIGN.md "catalog contract").</summary>
public static class Columns
{
#pragma warning disable CS1591 // the names are their own documentation; units are in the suffix
    // systems
    public const string SystemId = "system_id";
    public const string Weight = "weight";
    public const string ZLens = "z_lens";
    public const string ZSource = "z_source";
    public const string LensSigmaVKms = "lens_sigma_v_kms";
    public const string ThetaEArcsec = "theta_e_arcsec";
    public const string LensQ = "lens_q";
    public const string LensPaDeg = "lens_pa_deg";
    public const string ShearGamma = "shear_gamma";
    public const string ShearPaDeg = "shear_pa_deg";
    public const string SourceXArcsec = "source_x_arcsec";
    public const string SourceYArcsec = "source_y_arcsec";
    public const string NImages = "n_images";
    public const string TransientType = "transient_type";
    public const string T0Mjd = "t0_mjd";
    public const string TimeDelayDistanceMpc = "time_delay_distance_mpc";
    public const string Detected = "detected";
    public const string OnCaustic = "on_caustic";
    public const string PeakAbsoluteBMag = "peak_absolute_b_mag";
    public const string MaxDelayDays = "max_delay_days";
    public const string MaxSeparationArcsec = "max_separation_arcsec";
    public const string TotalMagnification = "total_magnification";
    public const string NDetections = "n_detections";
    public const string FirstDetectionMjd = "first_detection_mjd";
    public const string HostEbvMag = "host_ebv_mag";

    // images
    public const string ImageIndex = "image_index";
    public const string XArcsec = "x_arcsec";
    public const string YArcsec = "y_arcsec";
    public const string Magnification = "magnification";
    public const string DelayDays = "delay_days";
    public const string Kappa = "kappa";
    public const string Gamma = "gamma";
    public const string KappaStar = "kappa_star";
    public const string PeakMag = "peak_mag";
    public const string PeakBand = "peak_band";

    // observations
    public const string BlendGroup = "blend_group";
    public const string Mjd = "mjd";
    public const string Band = "band";
    public const string FluxNjy = "flux_njy";
    public const string FluxErrNjy = "flux_err_njy";
    public const string TrueFluxNjy = "true_flux_njy";
    public const string MicroMagnification = "micro_magnification";
    public const string Snr = "snr";
    public const string IsDetection = "is_detection";
    public const string Depth5SigmaMag = "depth_5sigma_mag";
    public const string SeeingFwhmArcsec = "seeing_fwhm_arcsec";

    // delay estimates
    public const string ImageA = "image_a";
    public const string ImageB = "image_b";
    public const string DelayErrDays = "delay_err_days";

    // training sets and features
    public const string Label = "label";
    public const string Split = "split";
    public const string NVisits = "n_visits";
    public const string PeakFluxNjy = "peak_flux_njy";
    public const string PeakMjd = "peak_mjd";
    public const string RiseDays = "rise_days";
    public const string DeclineDays = "decline_days";
    public const string ColourToNextBandMag = "colour_to_next_band_mag";
#pragma warning restore CS1591
}
