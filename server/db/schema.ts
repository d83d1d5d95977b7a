import { Account } from '../entities/account.entity'
import { Analysis } from '../entities/analysis.entity'
import { Annotation } from '../entities/annotation.entity'
import { AuthSession } from '../entities/auth-session.entity'
import { Blade } from '../entities/blade.entity'
import { BladeBaseline } from '../entities/blade-baseline.entity'
import { EmailToken } from '../entities/email-token.entity'
import { OutboundMail } from '../entities/outbound-mail.entity'
import { Photo } from '../entities/photo.entity'
import { ReferenceProfile } from '../entities/reference-profile.entity'
import { Sharpening } from '../entities/sharpening.entity'
import { SkatePair } from '../entities/skate-pair.entity'
import { ShopInvitation } from '../entities/shop-invitation.entity'
import { ShopMember } from '../entities/shop-member.entity'
import { ShopWearSetting } from '../entities/shop-wear-setting.entity'
import { Shop } from '../entities/shop.entity'
import { SkaterProfile } from '../entities/skater-profile.entity'
import { SkaterShare } from '../entities/skater-share.entity'
import { TargetSetting } from '../entities/target-setting.entity'
import { CreateSeedRuns1764640000000 } from '../migrations/1764640000000-CreateSeedRuns'
import { CreateOutboundMails1764640100000 } from '../migrations/1764640100000-CreateOutboundMails'
import { CreateAccounts1764650000000 } from '../migrations/1764650000000-CreateAccounts'
import { CreateSkatersShopsShares1764650100000 } from '../migrations/1764650100000-CreateSkatersShopsShares'
import { CreateBladeRecords1764660000000 } from '../migrations/1764660000000-CreateBladeRecords'
import { CreateTargetSettings1764670000000 } from '../migrations/1764670000000-CreateTargetSettings'
import { CreateBladeBaselines1764670100000 } from '../migrations/1764670100000-CreateBladeBaselines'
import { CreateReferenceProfiles1764670200000 } from '../migrations/1764670200000-CreateReferenceProfiles'
import { CreateShopWearSettings1764670300000 } from '../migrations/1764670300000-CreateShopWearSettings'

/**
 * Every entity and migration, imported explicitly: loading them by file glob bypasses the test runner's
 * TypeScript transform, and an explicit list shows in review what a change adds. Keep migrations in time order.
 */
export const entities = [OutboundMail, Account, AuthSession, EmailToken, SkaterProfile, Shop, ShopMember, ShopInvitation, SkaterShare,
  SkatePair, Blade, Photo, Analysis, Annotation, Sharpening, TargetSetting, BladeBaseline, ReferenceProfile, ShopWearSetting]

export const migrations = [
  CreateSeedRuns1764640000000,
  CreateOutboundMails1764640100000,
  CreateAccounts1764650000000,
  CreateSkatersShopsShares1764650100000,
  CreateBladeRecords1764660000000,
  CreateTargetSettings1764670000000,
  CreateBladeBaselines1764670100000,
  CreateReferenceProfiles1764670200000,
  CreateShopWearSettings1764670300000,
]
